/**
 * ag-grid cell renderer of the member id: a real link to the member page (so a middle click or
 * Ctrl/⌘-click opens it in a new tab, and "copy link" works), with a comment marker (count)
 * when the member has comments. A plain click is left to the grid, which opens the member in
 * this tab through the router.
 */
export function memberLinkCell(href: (member: string) => string | null, counts: Record<string, number>) {
  return (p: { value: unknown }): HTMLElement => {
    const id = String(p.value ?? '');
    const target = href(id);
    const wrap = document.createElement('span');
    const link = document.createElement(target ? 'a' : 'span');
    link.textContent = id;
    if (target && link instanceof HTMLAnchorElement) {
      link.className = 'member-link';
      link.dataset.test = 'member-link';
      link.href = target;
      // the grid keeps keyboard focus on cells (Enter opens the member); the link is for the pointer
      link.tabIndex = -1;
    }
    wrap.appendChild(link);
    const n = counts[id] ?? 0;
    if (n > 0) {
      const mark = document.createElement('span');
      mark.className = 'comment-marker mdi mdi-comment-text-outline';
      mark.dataset.test = 'comment-marker';
      mark.title = `${n} comment${n === 1 ? '' : 's'}`;
      mark.textContent = String(n);
      mark.style.marginLeft = '4px';
      mark.style.fontSize = '0.8em';
      mark.style.color = 'rgb(var(--v-theme-secondary))';
      wrap.appendChild(mark);
    }
    return wrap;
  };
}

/** True for a click the browser should handle itself (new tab or window, download). */
export function opensElsewhere(e: MouseEvent): boolean {
  return e.button !== 0 || e.ctrlKey || e.metaKey || e.shiftKey || e.altKey;
}
