import localFont from 'next/font/local';

// Shipped in fonts/ (from @fontsource-variable, OFL) because Google Fonts cannot be fetched here.
export const uiFont = localFont({ src: '../fonts/PublicSans-Variable.woff2', variable: '--font-ui', display: 'swap', weight: '100 900' });
export const figuresFont = localFont({ src: '../fonts/JetBrainsMono-Variable.woff2', variable: '--font-figures', display: 'swap', weight: '100 800' });
