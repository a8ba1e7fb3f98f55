// A correlation pooled over the lags a map cell spans: the running maximum over ±halfWidth lags, so a coarse SRP grid
// cannot step over a sharp PHAT peak (after Cobos, Martí & López 2011, the modified SRP-PHAT functional). Lags in samples.

/** out[k] = max(values[k − halfWidth .. k + halfWidth]) (clipped at the ends); O(n) with a monotonic queue. */
export function slidingMaximum(values: Float64Array, halfWidth: number): Float64Array {
  const n = values.length;
  const out = new Float64Array(n);
  const width = Math.max(0, Math.floor(halfWidth));
  const queue = new Int32Array(n);
  let head = 0;
  let tail = 0;
  let next = 0;
  for (let k = 0; k < n; k++) {
    // Admit every index up to k + width, keeping values in decreasing order.
    for (; next <= Math.min(n - 1, k + width); next++) {
      while (tail > head && values[queue[tail - 1]!]! <= values[next]!) tail--;
      queue[tail++] = next;
    }
    while (queue[head]! < k - width) head++;
    out[k] = values[queue[head]!]!;
  }
  return out;
}
