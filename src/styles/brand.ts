/**
 * Trenchward's own palette, handed to Quasar's `config.brand` (it becomes the --q-* CSS
 * variables). Petrol and clay come from the ground the product is about; the three verdict
 * colours are always paired with an icon and a word, so they never carry meaning alone.
 */
export const BRAND_COLOURS = {
  primary: '#173f4f',
  secondary: '#4f7a73',
  accent: '#c8672e',
  dark: '#1b2428',
  'dark-page': '#121a1d',
  positive: '#2b7a4b',
  negative: '#b42318',
  warning: '#a15c00',
  info: '#2f5f8a',
} as const
