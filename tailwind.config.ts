import type { Config } from 'tailwindcss';

// The one design-token file. Kiosk targets are at least 76 CSS px (about 20 mm; see ../shared/TESTING.md).
// Every text/background pair used on screen is at least 7:1 (checked with the WCAG relative-luminance formula):
// `text` shades are for words on ink panels, DEFAULT shades for words on paper, `bright` for fills under ink text.
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      fontFamily: { sans: ['Barlow', 'system-ui', 'sans-serif'] },
      // Each colour is a CSS variable (src/index.css) so the kiosk's daylight theme can swap the surfaces and the
      // words on them. `on-fill` is the ink on bright fills and the fills themselves keep their colour in both themes;
      // `edge` is a state's border or icon colour, the bright shade at night and a darker one in daylight.
      colors: {
        ink: {
          DEFAULT: 'var(--gw-ink)',
          soft: 'var(--gw-ink-soft)',
          raised: 'var(--gw-ink-raised)',
          line: 'var(--gw-ink-line)',
          muted: 'var(--gw-ink-muted)',
        },
        'on-fill': '#0f1a24',
        paper: { DEFAULT: 'var(--gw-paper)', card: '#ffffff', line: '#d8d2c4', muted: '#3d4a56' },
        // Cockpit convention: red warning, amber caution, green normal; always with a word and a shape too.
        normal: {
          DEFAULT: '#175c2c',
          bright: '#3ecf6a',
          text: 'var(--gw-normal-text)',
          edge: 'var(--gw-normal-edge)',
          tint: '#e3f4e8',
        },
        caution: {
          DEFAULT: '#6b4500',
          bright: '#ffb81c',
          text: 'var(--gw-caution-text)',
          edge: 'var(--gw-caution-edge)',
          tint: '#fff3d6',
        },
        warning: {
          DEFAULT: '#8f1d17',
          bright: '#ff5a4e',
          text: 'var(--gw-warning-text)',
          edge: 'var(--gw-warning-edge)',
          tint: '#fde4e1',
        },
        signal: {
          DEFAULT: '#174f8c',
          bright: '#5aa9ff',
          text: 'var(--gw-signal-text)',
          edge: 'var(--gw-signal-edge)',
          tint: '#e2eefb',
        },
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
