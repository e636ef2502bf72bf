/** What every plot shares: its Vega-Lite config (typeface, axes, no per-mark ARIA) and its title style. */
export const PLOT_CONFIG = {
  // the SVG carries one <title> and <desc> of our own; per-mark ARIA labels would repeat every data point
  aria: false,
  font: 'Inter, Helvetica, Arial, sans-serif',
  axis: {
    labelFontSize: 10,
    titleFontSize: 11,
    gridColor: '#d9dde3',
    domainColor: '#4a4f57',
    tickColor: '#4a4f57',
    labelColor: '#2b2f36',
    titleColor: '#2b2f36',
  },
  view: { stroke: '#9aa1ab' },
  background: 'white',
} as const;

export const titleOf = (text: string) => ({ text, anchor: 'start', fontSize: 13 });
