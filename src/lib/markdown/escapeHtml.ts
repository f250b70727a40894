/** `text` safe inside HTML text and quoted attributes: & < > " ' as numeric references. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}
