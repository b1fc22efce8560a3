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

/**
 * Fonts for the characters Inter and JetBrains Mono lack, tried in this order per character:
 * Noto Sans SC (Han, kana, CJK punctuation), Noto Sans KR (Hangul), Noto Emoji (monochrome: pdfkit
 * cannot draw colour emoji). Each is ~6–10 MB, so a document opens one only when its text needs it,
 * and pdfkit embeds only the glyphs drawn (a subset).
 */
export const FALLBACK_FONTS = [
  {
    name: 'fallback-sc',
    regular: require.resolve('@expo-google-fonts/noto-sans-sc/400Regular/NotoSansSC_400Regular.ttf'),
    bold: require.resolve('@expo-google-fonts/noto-sans-sc/700Bold/NotoSansSC_700Bold.ttf'),
  },
  {
    name: 'fallback-kr',
    regular: require.resolve('@expo-google-fonts/noto-sans-kr/400Regular/NotoSansKR_400Regular.ttf'),
    bold: require.resolve('@expo-google-fonts/noto-sans-kr/700Bold/NotoSansKR_700Bold.ttf'),
  },
  {
    name: 'fallback-emoji',
    regular: require.resolve('@expo-google-fonts/noto-emoji/400Regular/NotoEmoji_400Regular.ttf'),
    bold: require.resolve('@expo-google-fonts/noto-emoji/700Bold/NotoEmoji_700Bold.ttf'),
  },
] as const;

/** The fonts drawn bold (their fallbacks are the bold cuts). */
export const BOLD_FONTS = new Set(['ui-bold', 'ui-heavy']);
