/** xs[i] for an index the bench knows is there (its fixtures cycle by i % length); a missing one is a bug here. */
export function nth<T>(xs: ArrayLike<T>, i: number): T {
  const x = xs[i];
  if (x === undefined) throw new Error(`The bench read item ${i} of a list of ${xs.length}.`);
  return x;
}
