/**
 * Where a sequence of type ids occurs in a column of type ids: the index of
 * the first element of every match, in order. Matches may overlap ("a a" in
 * "a a a" matches at 0 and 1). When `unit` is given (e.g. each token's
 * sentence), a match must lie inside one unit.
 */
export function findSequence(
  types: ArrayLike<number>,
  sequence: ArrayLike<number>,
  unit?: ArrayLike<number>,
  from = 0,
  to = types.length,
): number[] {
  const out: number[] = [];
  const len = sequence.length;
  if (len === 0) return out;
  const first = sequence[0]!;
  const last = to - len;
  for (let i = from; i <= last; i++) {
    if (types[i] !== first) continue;
    let k = 1;
    while (k < len && types[i + k] === sequence[k]) k++;
    if (k < len) continue;
    if (unit && unit[i] !== unit[i + len - 1]) continue;
    out.push(i);
  }
  return out;
}
