/**
 * Windowsill design system: a warm "paper" ground, deep "ink" text, and accents named after
 * what they mean in the product — `lumen` (light, lamps), `glass` (walls, transmission),
 * `uv` (short-wavelength cautions) and `leaf` / `ember` for good / bad outcomes; `budget` colours the five
 * destinations of a lamp's photons (wall, solvent, other species, intended absorber, passing through).
 * Loaded by Tailwind 4 through `@config` in src/app.css.
 */
import type { Config } from 'tailwindcss';

export default {
	content: ['./src/**/*.{html,svelte,ts}'],
	theme: {
		extend: {
			colors: {
				paper: { DEFAULT: '#f7f4ec', deep: '#efe9db', edge: '#ddd4c0' },
				ink: {
					50: '#eef1f6', 100: '#d9dfea', 200: '#b3bfd4', 300: '#8c9dbd', 400: '#667ba4',
					500: '#4c5f87', 600: '#3b4b6c', 700: '#2e3b56', 800: '#26324a', 900: '#1b2436'
				},
				lumen: { 50: '#fdf6e7', 100: '#fae8c0', 300: '#f2c36a', 500: '#e9a23b', 700: '#b8731a', 900: '#6e4210' },
				glass: { 50: '#e9f5f3', 100: '#c8e8e3', 300: '#7fc6bb', 500: '#3c9c8f', 700: '#276e65', 900: '#173f3a' },
				uv: { 50: '#f3eefc', 100: '#e2d5f8', 300: '#b596ec', 500: '#7d4fd6', 700: '#5a31a6', 900: '#321a5e' },
				leaf: { 100: '#dcefd8', 500: '#4b8f3f', 700: '#336529' },
				ember: { 100: '#f8dcd5', 500: '#c4492f', 700: '#8f2f1c' },
				// Where a lamp's photons go (the photon budget bars on the Window finder); also used by the plots.
				budget: { wall: '#276e65', solvent: '#8c9dbd', other: '#c4492f', intended: '#e9a23b', through: '#efe9db' }
			},
			fontFamily: {
				sans: ['"Inter Variable"', 'system-ui', 'sans-serif'],
				mono: ['"IBM Plex Mono"', 'ui-monospace', 'monospace']
			},
			fontSize: {
				// A 1.2 ratio type scale; numbers are rem / line-height.
				caption: ['0.75rem', { lineHeight: '1rem' }],
				body: ['0.9375rem', { lineHeight: '1.45rem' }],
				lead: ['1.125rem', { lineHeight: '1.7rem' }],
				h3: ['1.35rem', { lineHeight: '1.8rem', fontWeight: '600' }],
				h2: ['1.62rem', { lineHeight: '2.1rem', fontWeight: '600' }],
				h1: ['1.95rem', { lineHeight: '2.4rem', fontWeight: '700' }],
				display: ['2.8rem', { lineHeight: '3.2rem', fontWeight: '700' }]
			},
			borderRadius: { sill: '0.375rem' },
			boxShadow: { pane: '0 1px 0 #ddd4c0, 0 1px 3px rgba(27,36,54,0.08)' }
		}
	}
} satisfies Config;
