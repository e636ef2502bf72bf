/** Text placed in HTML or SVG markup: &, <, > and " escaped (enough for element text and quoted attributes). */
export function escapeMarkup(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

/**
 * Text from a user's files shown on a terminal: control characters (C0 but
 * tab, DEL, C1) and the bidirectional overrides are written as visible
 * escapes, so that no part number or file name can move the cursor, hide a
 * FAIL (ESC[8m) or reorder a line. Newlines are escaped too: one value, one line.
 */
export function printable(s: string): string {
  return s.replace(/[\u0000-\u0008\u000a-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/g, (c) => {
    const n = c.charCodeAt(0);
    return n < 0x100 ? `\\x${n.toString(16).padStart(2, '0')}` : `\\u${n.toString(16)}`;
  });
}
