import { describe, expect, it } from 'vitest';
import { breadcrumbsFor } from '../../src/utils/breadcrumbs.js';

describe('breadcrumbsFor', () => {
  it('puts the project name after a link to the projects list', () => {
    const crumbs = breadcrumbsFor({ routeName: 'project', params: { id: '7' }, projectName: 'Footbridge' });
    expect(crumbs).toEqual([
      { title: 'Projects', to: { name: 'projects' } },
      { title: 'Footbridge', disabled: true },
    ]);
  });

  it('names a project by its number until its name is known', () => {
    expect(breadcrumbsFor({ routeName: 'project', params: { id: '7' } }).at(-1)?.title).toBe('Project 7');
  });

  it('has no trail for an unknown route', () => {
    expect(breadcrumbsFor({ routeName: null, params: {} })).toEqual([]);
  });
});
