/**
 * The "site notebook" palette: warm paper, graphite ink, timber, straw (the base layer), teal (the
 * cross layer), brick (warnings, exclusions) and sky (ventilation). One set of tokens read by the
 * Tailwind theme (tailwind.config.ts), the plan editor's canvas, the PDFs and the payment pages,
 * so a colour changed here changes everywhere. Values are sRGB hex.
 */
export const PALETTE_TOKENS = {
  paper: { DEFAULT: '#faf7f0', dark: '#f1ecdf', line: '#e7e0cf', 'line-strong': '#d8cfb8' },
  graphite: { DEFAULT: '#33363b', light: '#5b6068', faint: '#9aa0a8' },
  timber: { DEFAULT: '#8a5a2b', light: '#b88a5a' },
  straw: { DEFAULT: '#e2b94b', light: '#f3dc93', dark: '#a57e16' },
  teal: { DEFAULT: '#1f8a84', light: '#9fd6d1', dark: '#135e5a' },
  brick: { DEFAULT: '#b0462f', light: '#e8b4a6', dark: '#7c2d1d' },
  sky: { DEFAULT: '#a9d4ef', light: '#dceefa', dark: '#3d86b8' },
  /** The editor's selection outline: a blue that reads against every other token. */
  select: { DEFAULT: '#1f6fd1' },
} as const;

type Tokens = typeof PALETTE_TOKENS;
type Camel<S extends string> = S extends `${infer A}-${infer B}` ? `${A}${Capitalize<Camel<B>>}` : S;
type Flat = {
  [F in keyof Tokens & string]: { [K in keyof Tokens[F] & string]: K extends 'DEFAULT' ? F : `${F}${Capitalize<Camel<K>>}` }[keyof Tokens[F] & string];
}[keyof Tokens & string];

const camel = (s: string) => s.replace(/-(\w)/g, (_, c: string) => c.toUpperCase());

/** The same tokens flat, for code: `PALETTE.paperLine`, `PALETTE.strawDark`, `PALETTE.graphite`. */
export const PALETTE = Object.fromEntries(
  Object.entries(PALETTE_TOKENS).flatMap(([family, shades]) =>
    Object.entries(shades).map(([k, hex]) => [k === 'DEFAULT' ? family : `${family}${camel(k[0].toUpperCase() + k.slice(1))}`, hex]),
  ),
) as Record<Flat, string>;
