/** A bounded undo/redo history of whole-grid snapshots. */
export class UndoHistory<T> {
  private past: T[] = [];
  private future: T[] = [];
  constructor(private readonly limit = 200) {}

  /** Remember the state before a change; a new change forgets what could be redone. */
  record(before: T): void {
    this.past.push(before);
    if (this.past.length > this.limit) this.past.shift();
    this.future = [];
  }

  undo(current: T): T | undefined {
    const previous = this.past.pop();
    if (previous !== undefined) this.future.push(current);
    return previous;
  }

  redo(current: T): T | undefined {
    const next = this.future.pop();
    if (next !== undefined) this.past.push(current);
    return next;
  }

  clear(): void {
    this.past = [];
    this.future = [];
  }

  get canUndo(): boolean {
    return this.past.length > 0;
  }
}
