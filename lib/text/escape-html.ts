// Escape text for safe inclusion in HTML (e-mail bodies built as strings).
// React escapes by itself; this is only for HTML we assemble by hand.
const ENTITIES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/**
 * @example
 * escapeHtml('<b>"Φ"</b>'); // '&lt;b&gt;&quot;Φ&quot;&lt;/b&gt;'
 */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (char) => ENTITIES[char]);
}
