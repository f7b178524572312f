// All tuples of a product of finite domains, in odometer order (last position fastest):
// how quantifiers and parameters range over the objects of their types.
export function* cartesian<T>(domains: ReadonlyArray<readonly T[]>): Generator<T[]> {
  if (domains.some((d) => d.length === 0)) return;
  const idx = new Array<number>(domains.length).fill(0);
  for (;;) {
    yield idx.map((j, i) => domains[i][j]);
    let i = domains.length - 1;
    while (i >= 0 && ++idx[i] === domains[i].length) idx[i--] = 0;
    if (i < 0) return;
  }
}
