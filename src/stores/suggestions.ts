/**
 * Section suggestions: the proposals of one run, the rows chosen, and applying them (one new
 * model version, then a run of it, which the runs store watches).
 */
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import type { AppliedSuggestions, SectionProposal, SuggestRequest, Suggestions } from '../../shared/schemas/suggestions.js';
import { applySuggestions, suggestSections } from '../api/suggestions.js';
import { errorMessage } from '../utils/format.js';
import { useModelsStore } from './models.js';
import { useRunsStore } from './runs.js';

export const useSuggestionsStore = defineStore('suggestions', () => {
  const result = ref<Suggestions | null>(null);
  /** keys (`unit:key`) of the proposals chosen for applying */
  const chosen = ref<string[]>([]);
  const loading = ref(false);
  const applying = ref(false);
  const error = ref<string | null>(null);
  const applied = ref<AppliedSuggestions | null>(null);

  const rowKey = (p: Pick<SectionProposal, 'unit' | 'key'>) => `${p.unit}:${p.key}`;
  const chosenProposals = computed(() => (result.value?.proposals ?? []).filter((p) => p.change && p.proposed && chosen.value.includes(rowKey(p))));
  /** mass change of the chosen proposals, kg */
  const chosenMassChange = computed(() => chosenProposals.value.reduce((s, p) => s + p.massChange, 0));
  const changeCount = computed(() => chosenProposals.value.reduce((n, p) => n + p.members.length, 0));

  function reset(): void {
    result.value = null;
    chosen.value = [];
    error.value = null;
    applied.value = null;
  }

  /** Proposals for a run; every proposal that changes a section starts chosen. */
  async function suggest(runId: number, input: SuggestRequest): Promise<void> {
    loading.value = true;
    error.value = null;
    applied.value = null;
    try {
      result.value = await suggestSections(runId, input);
      chosen.value = result.value.proposals.filter((p) => p.change).map(rowKey);
    } catch (err) {
      result.value = null;
      error.value = errorMessage(err);
    } finally {
      loading.value = false;
    }
  }

  /** Applies the chosen proposals as one new version and follows the run started on it. */
  async function apply(): Promise<AppliedSuggestions | null> {
    const r = result.value;
    if (!r || chosenProposals.value.length === 0) return null;
    applying.value = true;
    error.value = null;
    try {
      const changes = chosenProposals.value.flatMap((p) => p.members.map((member) => ({ member, section: p.proposed! })));
      const n = changes.length;
      const out = await applySuggestions(r.runId, {
        changes,
        message: `sections of ${n} member${n === 1 ? '' : 's'} from the suggestions of run ${r.runId}${r.iterations ? ` (${r.iterations} analysis passes)` : ''}`,
      });
      applied.value = out;
      void useRunsStore().watchRun(out.run.id);
      void useModelsStore().open(r.modelId);
      return out;
    } catch (err) {
      error.value = errorMessage(err);
      return null;
    } finally {
      applying.value = false;
    }
  }

  return { result, chosen, loading, applying, error, applied, chosenProposals, chosenMassChange, changeCount, rowKey, reset, suggest, apply };
});
