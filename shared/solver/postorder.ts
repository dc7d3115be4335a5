/** Postorder of an elimination tree (children visited in index order), iterative depth-first. */
export function postorder(parent: Int32Array): Int32Array {
  const n = parent.length;
  const head = new Int32Array(n).fill(-1);
  const next = new Int32Array(n);
  for (let j = n - 1; j >= 0; j--) {
    const p = parent[j];
    if (p === -1) continue;
    next[j] = head[p];
    head[p] = j;
  }
  const post = new Int32Array(n);
  const stack = new Int32Array(n);
  let k = 0;
  for (let j = 0; j < n; j++) {
    if (parent[j] !== -1) continue;
    let top = 0;
    stack[0] = j;
    while (top >= 0) {
      const p = stack[top];
      const i = head[p];
      if (i === -1) {
        top--;
        post[k++] = p;
      } else {
        head[p] = next[i];
        stack[++top] = i;
      }
    }
  }
  return post;
}
