import type { Config } from 'tailwindcss';

// The one design-token file. Kiosk targets are at least 76 CSS px (about 20 mm; see ../shared/TESTING.md).
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      fontFamily: { sans: ['Barlow', 'system-ui', 'sans-serif'] },
      colors: {
        ink: { DEFAULT: '#0f1a24', soft: '#1c2b38', line: '#2e4152' },
        paper: { DEFAULT: '#f4f1ea', card: '#ffffff', line: '#d8d2c4' },
        // Cockpit convention: red warning, amber caution, green normal; always with a word and a shape too.
        normal: { DEFAULT: '#1f7a3a', bright: '#3ecf6a', tint: '#e3f4e8' },
        caution: { DEFAULT: '#8a5a00', bright: '#ffb81c', tint: '#fff3d6' },
        warning: { DEFAULT: '#b3261e', bright: '#ff5a4e', tint: '#fde4e1' },
        signal: { DEFAULT: '#1d5fa8', bright: '#5aa9ff', tint: '#e2eefb' },
      },
      spacing: { touch: '76px', 'touch-lg': '96px' },
      minHeight: { touch: '76px' },
      minWidth: { touch: '76px' },
      fontSize: { body: ['20px', '28px'], reading: ['44px', '48px'], fleet: ['72px', '76px'] },
    },
  },
} satisfies Config;
