// Nestflow palette (tailwind.config.ts) for canvas drawing, which cannot read Tailwind classes.
export const CHART_COLOURS = {
  mean: '#57469c', // brand-600
  min: '#8a6318', // straw-700
  point: '#47387f', // brand-700
  threshold: '#b42323', // danger-600
  eventLight: 'rgba(246, 215, 155, 0.55)', // warn-200
  eventDeep: 'rgba(166, 95, 0, 0.30)', // warn-600
  eventDeepHatch: 'rgba(122, 70, 0, 0.55)', // warn-800, hatching over the deeper bands
  eventDeepMarker: '#7a4500', // warn-800
  pulse: '#1f7a4a', // ok-600
  targetBand: 'rgba(185, 224, 200, 0.45)', // ok-200
  axis: '#3d3850', // ink-700
  grid: '#e6e1d9', // surface-200
} as const;

export const CHART_FONT = '12px "Nunito Sans", ui-sans-serif, system-ui, sans-serif';
