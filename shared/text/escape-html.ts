const entities: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/**
 * Text made safe to put inside HTML or XML (SVG) element content and quoted attribute values:
 * the five characters with a meaning there become entity references. The one escape helper of
 * the project; Handlebars templates escape with their own `{{ }}`.
 */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => entities[c] ?? c);
}
