/** Part notes: Markdown with raw HTML disabled, so nothing in a spec can inject markup. */
import MarkdownIt from 'markdown-it';

const md = new MarkdownIt({ html: false, linkify: false, typographer: false });

export function renderMarkdown(text: string): string {
  return md.render(text);
}
