import localFont from 'next/font/local';

export const uiFont = localFont({
  src: '../fonts/inter-latin-wght.woff2',
  variable: '--font-ui',
  weight: '100 900',
  display: 'swap',
});

export const figuresFont = localFont({
  src: '../fonts/jetbrains-mono-latin-wght.woff2',
  variable: '--font-figures',
  weight: '100 800',
  display: 'swap',
});
