import type { Config } from 'tailwindcss';

// The one design-token file. Kiosk targets are at least 76 CSS px (about 20 mm; see ../shared/TESTING.md).
// Every text/background pair used on screen is at least 7:1 (checked with the WCAG relative-luminance formula):
// `text` shades are for words on ink panels, DEFAULT shades for words on paper, `bright` for fills under ink text.
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      fontFamily: { sans: ['Barlow', 'system-ui', 'sans-serif'] },
      colors: {
        ink: { DEFAULT: '#0f1a24', soft: '#1c2b38', raised: '#243646', line: '#3a5166', muted: '#b9c3cc' },
        paper: { DEFAULT: '#f4f1ea', card: '#ffffff', line: '#d8d2c4', muted: '#3d4a56' },
        // Cockpit convention: red warning, amber caution, green normal; always with a word and a shape too.
        normal: { DEFAULT: '#175c2c', bright: '#3ecf6a', text: '#5ee08a', tint: '#e3f4e8' },
        caution: { DEFAULT: '#6b4500', bright: '#ffb81c', text: '#ffc94d', tint: '#fff3d6' },
        warning: { DEFAULT: '#8f1d17', bright: '#ff5a4e', text: '#ffa39b', tint: '#fde4e1' },
        signal: { DEFAULT: '#174f8c', bright: '#5aa9ff', text: '#8cc4ff', tint: '#e2eefb' },
      },
      spacing: { touch: '76px', 'touch-lg': '96px' },
      minHeight: { touch: '76px', 'touch-lg': '96px' },
      minWidth: { touch: '76px', 'touch-lg': '96px' },
      fontSize: {
        body: ['20px', '28px'],
        lead: ['26px', '34px'],
        reading: ['44px', '48px'],
        fleet: ['72px', '76px'],
      },
    },
  },
} satisfies Config;
