/** Text made safe to place in HTML (element text or a quoted attribute), for the mailed HTML bodies. */

const ENTITIES: Readonly<Record<string, string>> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Escapes the five HTML-special characters, e.g. escapeHtml('<b>&"') → '&lt;b&gt;&amp;&quot;' */
export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ENTITIES[c]!);
}
