/**
 * Text of an uploaded file, which must be UTF-8. Invalid bytes are refused rather than replaced
 * (a Latin-1 "°" would otherwise become "�" in a stored name), and so are NUL characters: a
 * UTF-16 file without a byte-order mark is valid UTF-8 with a NUL after every letter, and
 * PostgreSQL cannot store NUL in text.
 */
export function decodeUtf8Text(bytes: Uint8Array): { ok: true; text: string } | { ok: false; reason: string } {
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return { ok: false, reason: "it holds bytes that are not UTF-8 (Latin-1 or UTF-16, perhaps)" };
  }
  if (text.includes("\u0000")) return { ok: false, reason: "it holds NUL characters, as UTF-16 files do" };
  return { ok: true, text };
}
