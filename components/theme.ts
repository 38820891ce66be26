// Tactus's look: warm paper, deep teal ink, an amber accent for tempo. One place for colours, type and spacing.
export const colors = {
  paper: '#f6f3ec',
  card: '#fffdf8',
  ink: '#1d2327',
  muted: '#5f666d',
  line: '#e3dccd',
  teal: '#1f5f5b',
  tealDark: '#154542',
  tealSoft: '#d9e8e5',
  amber: '#c9761c',
  amberSoft: '#f7e6cf',
  danger: '#b3261e',
  dangerSoft: '#f8dcd9',
  white: '#ffffff',
};

export const fonts = {
  body: 'Manrope_400Regular',
  bodyMedium: 'Manrope_600SemiBold',
  bodyBold: 'Manrope_700Bold',
  display: 'SpaceGrotesk_600SemiBold',
  displayBold: 'SpaceGrotesk_700Bold',
};

/** A modular scale (ratio ~1.2) from a 16 px body. */
export const type = {
  small: { fontFamily: fonts.body, fontSize: 13, lineHeight: 18 },
  body: { fontFamily: fonts.body, fontSize: 16, lineHeight: 24 },
  label: { fontFamily: fonts.bodyMedium, fontSize: 14, lineHeight: 20 },
  h3: { fontFamily: fonts.display, fontSize: 19, lineHeight: 24 },
  h2: { fontFamily: fonts.display, fontSize: 23, lineHeight: 28 },
  h1: { fontFamily: fonts.displayBold, fontSize: 28, lineHeight: 34 },
  tempo: { fontFamily: fonts.displayBold, fontSize: 40, lineHeight: 44 },
};

export const space = { xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32 };
export const radius = { sm: 8, md: 12, lg: 18 };

/** Wide screens get the navigation beside the content and a capped reading width. */
export const layout = { wideFrom: 900, contentMax: 760, wideContentMax: 1120, railWidth: 220, minTouch: 44 };
