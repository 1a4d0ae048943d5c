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
        // The border of a box one types into: rule would be 1.3:1 against the card, and
        // WCAG 1.4.11 asks 3:1 for what shows a control is there (DEVELOPERS.md).
        edge: '#958A81',
        copper: '#B5562B',
        // Copper taken a step towards ink, for hover states: white on it and it on paper
        // stay above WCAG AA's 4.5:1, where a paler copper would fall below (DEVELOPERS.md).
        'copper-deep': '#A04E29',
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
