/** The lab this browser used last, so "/" can open it again. */
const KEY = "rhomb.lastLabId";

export function rememberLab(labId: string): void {
  try {
    localStorage.setItem(KEY, labId);
  } catch {
    // Storage may be off (private mode); "/" then opens the first lab.
  }
}

export function lastLabId(): string | null {
  try {
    return localStorage.getItem(KEY);
  } catch {
    return null;
  }
}
