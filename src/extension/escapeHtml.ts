const HTML_ESCAPES: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};

/**
 * Makes any text inert inside HTML element content or a quoted attribute value, so labels from the
 * user's document (`</script>`, `<img onerror=...>`) stay text. The one escaping helper of the panel.
 * @param text any string
 * @returns the text with & < > " ' replaced by character references
 */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (ch) => HTML_ESCAPES[ch]);
}
