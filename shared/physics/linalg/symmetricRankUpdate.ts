/**
 * H_ab = Σ_k s_k j_k,a j_k,b (the Gauss–Newton part of a Hessian, BLAS "syrk") for the
 * parameters a, b listed in `active`, from the vectors j_k stored transposed
 * (jt[a · rows + k] = j_k,a) so that each entry is a dot product over contiguous memory.
 * Entries are computed in 4×2 blocks (eight running sums share six loads), which measured
 * 2–3× faster than adding one outer product per row; each entry still sums over k in order,
 * with the factor s_k j_k,a of the larger index a. Writes H (n×n, row-major) at the listed
 * pairs, both triangles.
 */
export function symmetricRankUpdate(
  jt: Float64Array,
  s: Float64Array,
  rows: number,
  n: number,
  h: Float64Array,
  scaled: Float64Array,
  active: Int32Array,
): void {
  const m = active.length;
  for (let ia = 0; ia < m; ia++) {
    const o = active[ia] * rows;
    for (let k = 0; k < rows; k++) scaled[o + k] = s[k] * jt[o + k];
  }
  for (let ia = 0; ia < m; ia += 4) {
    const a0 = active[ia], a1 = active[Math.min(ia + 1, m - 1)], a2 = active[Math.min(ia + 2, m - 1)], a3 = active[Math.min(ia + 3, m - 1)];
    const o0 = a0 * rows, o1 = a1 * rows, o2 = a2 * rows, o3 = a3 * rows;
    const last = Math.min(ia + 3, m - 1);
    for (let ib = 0; ib <= last; ib += 2) {
      const b0 = active[ib], b1 = active[Math.min(ib + 1, m - 1)];
      const p0 = b0 * rows, p1 = b1 * rows;
      let s00 = 0, s01 = 0, s10 = 0, s11 = 0, s20 = 0, s21 = 0, s30 = 0, s31 = 0;
      for (let k = 0; k < rows; k++) {
        const y0 = jt[p0 + k], y1 = jt[p1 + k];
        const x0 = scaled[o0 + k], x1 = scaled[o1 + k], x2 = scaled[o2 + k], x3 = scaled[o3 + k];
        s00 += x0 * y0;
        s01 += x0 * y1;
        s10 += x1 * y0;
        s11 += x1 * y1;
        s20 += x2 * y0;
        s21 += x2 * y1;
        s30 += x3 * y0;
        s31 += x3 * y1;
      }
      // Keep only entries with a ≥ b (lower triangle, the factor on the larger index), mirrored.
      put(h, n, m, ia, ib, a0, b0, s00);
      put(h, n, m, ia, ib + 1, a0, b1, s01);
      put(h, n, m, ia + 1, ib, a1, b0, s10);
      put(h, n, m, ia + 1, ib + 1, a1, b1, s11);
      put(h, n, m, ia + 2, ib, a2, b0, s20);
      put(h, n, m, ia + 2, ib + 1, a2, b1, s21);
      put(h, n, m, ia + 3, ib, a3, b0, s30);
      put(h, n, m, ia + 3, ib + 1, a3, b1, s31);
    }
  }
}

/** Positions past the end of the list (clamped duplicates) and above the diagonal are skipped; the mirror writes the latter. */
function put(h: Float64Array, n: number, m: number, ia: number, ib: number, a: number, b: number, v: number): void {
  if (ia >= m || ib > ia) return;
  h[a * n + b] = v;
  h[b * n + a] = v;
}
