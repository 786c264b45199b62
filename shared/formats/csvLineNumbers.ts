/**
 * Line numbers for CSV error messages. Papa Parse reports a byte cursor, not a line (a quoted
 * field may span lines), so the parsers map the cursor back to a 1-based line of the text.
 */
export class CsvLineNumbers {
  private readonly newlines: number[] = [];

  constructor(private readonly text: string) {
    for (let i = 0; i < text.length; i++) if (text[i] === "\n") this.newlines.push(i);
  }

  /** 1-based line of the record that ends just before `cursor`. */
  lineBefore(cursor: number): number {
    const { text, newlines } = this;
    let q = cursor - 1;
    while (q > 0 && (text[q] === "\n" || text[q] === "\r")) q--;
    let lo = 0;
    let hi = newlines.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (newlines[mid] < q) lo = mid + 1;
      else hi = mid;
    }
    return lo + 1;
  }
}
