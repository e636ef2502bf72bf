/** Text placed in HTML or SVG markup: &, <, > and " escaped (enough for element text and quoted attributes). */
export function escapeMarkup(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}
