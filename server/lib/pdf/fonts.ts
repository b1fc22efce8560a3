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
