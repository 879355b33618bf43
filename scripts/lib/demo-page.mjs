// The demo consultancy's page: its template with the seed's embed snippets in their places.

/** The calculator a snippet embeds, read from the snippet itself (its host element names it). */
export const calculatorOf = (snippet) => /data-calculator="([a-z0-9-]+)"/.exec(snippet)?.[1];

/**
 * `{{WIDGET_ABSORPTION}}` takes the absorption-coefficient widget, `{{WIDGET_n}}` the n-th widget of
 * the seed's list; a slot with no widget is left empty rather than printed.
 * @param {string} template the page's HTML
 * @param {{ snippet: string }[]} widgets the seed's widgets, in its order
 */
export function demoPage(template, widgets) {
  const absorption = widgets.find((w) => calculatorOf(w.snippet) === 'absorption-coefficient');
  return template
    .replace('{{WIDGET_ABSORPTION}}', absorption?.snippet ?? '')
    .replace(/\{\{WIDGET_(\d+)\}\}/g, (_, n) => widgets[Number(n) - 1]?.snippet ?? '');
}
