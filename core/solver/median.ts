/**
 * Median of values[0 … count) by Hoare's selection (quickselect, C. A. R. Hoare, Comm. ACM 4,
 * 321, 1961) with median-of-three pivots: expected O(count). Reorders `values` in place.
 * For an even count returns the mean of the two middle values. Throws on count 0.
 */
export function medianInPlace(values: Float64Array, count: number): number {
  if (count <= 0) throw new RangeError('medianInPlace: no values; pass at least one');
  const upper = select(values, count, count >> 1);
  if (count % 2 === 1) return upper;
  let lower = -Infinity;
  for (let i = 0; i < count >> 1; i++) if (values[i] > lower) lower = values[i];
  return (lower + upper) / 2;
}

/** Puts the k-th smallest of values[0 … count) at index k (everything before it ≤, after ≥) and returns it. */
function select(values: Float64Array, count: number, k: number): number {
  let left = 0;
  let right = count - 1;
  while (right > left) {
    const middle = (left + right) >> 1;
    const a = values[left];
    const b = values[middle];
    const c = values[right];
    const pivot = a < b ? (b < c ? b : a < c ? c : a) : a < c ? a : b < c ? c : b;
    let i = left;
    let j = right;
    while (i <= j) {
      while (values[i] < pivot) i++;
      while (values[j] > pivot) j--;
      if (i <= j) {
        const swap = values[i];
        values[i] = values[j];
        values[j] = swap;
        i++;
        j--;
      }
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else break;
  }
  return values[k];
}
