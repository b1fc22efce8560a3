import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);

/**
 * Full TTFs shipped with the app (npm packages, no download): pdfkit cannot embed WOFF2 and the
 * @fontsource files are subset per script, so a PDF would miss glyphs.
 */
export const FONTS = {
  regular: require.resolve('@expo-google-fonts/inter/400Regular/Inter_400Regular.ttf'),
  semibold: require.resolve('@expo-google-fonts/inter/600SemiBold/Inter_600SemiBold.ttf'),
  bold: require.resolve('@expo-google-fonts/inter/700Bold/Inter_700Bold.ttf'),
  mono: require.resolve('@expo-google-fonts/jetbrains-mono/400Regular/JetBrainsMono_400Regular.ttf'),
};

/** The notebook palette (tailwind.config.ts), as hex for pdfkit. */
export const INK = {
  graphite: '#33363b',
  graphiteLight: '#6b7078',
  timber: '#8a5a2b',
  straw: '#d9b45a',
  teal: '#2f7f7a',
  brick: '#b0462f',
  sky: '#9cc7e4',
  paperLine: '#e7e0cf',
  paper: '#fbf8f1',
};
