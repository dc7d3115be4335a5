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
    case 'admin-users':
      return [current('Administration'), current('Users')];
    case 'about':
      return [current('About Trestle')];
    case 'forbidden':
      return [current('Not allowed')];
    case 'not-found':
      return [current('Page not found')];
    default:
      return [];
  }
}
