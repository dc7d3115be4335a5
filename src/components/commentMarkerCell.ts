/** ag-grid cell renderer for the member id with a comment marker (count) when the member has comments. */
export function commentMarkerCell(counts: Record<string, number>) {
  return (p: { value: unknown }): HTMLElement => {
    const span = document.createElement('span');
    const id = String(p.value ?? '');
    span.textContent = id;
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
      span.appendChild(mark);
    }
    return span;
  };
}
