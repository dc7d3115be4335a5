/** Breadcrumb trail for the app bar, from the route's name and the names it can know. */

export interface Crumb {
  title: string;
  to?: { name: string; params?: Record<string, string | number> };
  disabled?: boolean;
}

export interface CrumbContext {
  routeName: string | null;
  params: Record<string, string | string[] | undefined>;
  /** Name of the project being shown, when known. */
  projectName?: string | null;
  /** The model being shown (model, compare and member pages), when known. */
  model?: { id: number; name: string; projectId: number } | null;
}

/** The trail for a page; the last crumb is the current page and is not a link. */
export function breadcrumbsFor(ctx: CrumbContext): Crumb[] {
  const projects: Crumb = { title: 'Projects', to: { name: 'projects' } };
  const current = (title: string): Crumb => ({ title, disabled: true });
  switch (ctx.routeName) {
    case 'projects':
      return [current('Projects')];
    case 'project': {
      const id = String(ctx.params.id ?? '');
      return [projects, current(ctx.projectName || `Project ${id}`)];
    }
    case 'import': {
      const id = String(ctx.params.id ?? '');
      return [projects, { title: ctx.projectName || `Project ${id}`, to: { name: 'project', params: { id } } }, current('Import')];
    }
    case 'model':
    case 'compare':
    case 'member': {
      const m = ctx.model;
      const trail: Crumb[] = [projects];
      if (m) {
        trail.push({ title: ctx.projectName || `Project ${m.projectId}`, to: { name: 'project', params: { id: m.projectId } } });
        if (ctx.routeName === 'model') return [...trail, current(m.name)];
        trail.push({ title: m.name, to: { name: 'model', params: { id: m.id } } });
      }
      if (ctx.routeName === 'compare') return [...trail, current('Compare runs')];
      if (ctx.routeName === 'member') return [...trail, current(`Member ${String(ctx.params.member ?? '')}`)];
      return [...trail, current('Model')];
    }
    case 'audit':
      return [current('Audit trail')];
    case 'outbox':
      return [current('Mail')];
    case 'admin-users':
      return [current('Administration'), current('Users')];
    case 'about':
      return [current('About Trestle')];
    case 'conventions':
      return [current('Help'), current('Axes, signs and units')];
    case 'forbidden':
      return [current('Not allowed')];
    case 'not-found':
      return [current('Page not found')];
    default:
      return [];
  }
}
