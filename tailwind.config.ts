import type { Config } from 'tailwindcss';

// The product's own palette (see DEVELOPERS.md, "Look"). Components use these
// names, never raw hex values.
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: '#F7F3EC',
        card: '#FFFDF9',
        ink: '#2A2320',
        muted: '#6B5F57',
        rule: '#E4DBCF',
        copper: '#B5562B',
        slate: '#3E5C76',
        butter: '#E8C268',
        rose: '#B23A48',
        olive: '#5E6B2E',
      },
      fontFamily: {
        sans: ['"DM Sans"', 'system-ui', 'sans-serif'],
      },
    },
  },
} satisfies Config;
