// echarts draws tooltips as HTML: whatever a formatter returns is parsed as markup. Every chart formatter
// builds its HTML here, so a material, core or order name is always shown as the text it is.

const ENTITIES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Text with the characters that start markup replaced by entities. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ENTITIES[c]);
}

/** A tooltip of plain-text lines: each line escaped, the lines joined with line breaks. */
export function tooltipLines(...lines: string[]): string {
  return lines.map(escapeHtml).join('<br>');
}
