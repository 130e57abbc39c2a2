/**
 * The ant-design-vue theme for signed-in screens and the sign-in pages. Colours come from
 * the CSS variables in src/styles/base.css (read once at start), so the palette has one source;
 * the fallbacks only matter if the stylesheet failed to load.
 */
import type { ThemeConfig } from 'ant-design-vue/es/config-provider/context';

function cssVariable(name: string, fallback: string): string {
  if (typeof document === 'undefined') return fallback;
  const value = getComputedStyle(document.documentElement).getPropertyValue(name).trim();
  return value || fallback;
}

/** Built on first use, after base.css has been applied to the document. */
export function waymarkTheme(): ThemeConfig {
  const navy = cssVariable('--wm-navy', '#14365a');
  const faint = cssVariable('--wm-ink-faint', '#616d7a');
  return {
    token: {
      colorPrimary: navy,
      colorLink: navy,
      colorWarning: cssVariable('--wm-amber', '#f2a900'),
      colorError: cssVariable('--wm-danger', '#b42318'),
      colorSuccess: cssVariable('--wm-ok', '#1f7a4d'),
      colorText: cssVariable('--wm-ink', '#14202b'),
      // The library's faint grey (#8c8c8c: form hints, counters, legends) reads at 3.4:1 on white; this
      // slate keeps it lighter than the body text yet above WCAG 1.4.3's 4.5:1 on every card and tint we use.
      colorTextTertiary: faint,
      colorBorder: cssVariable('--wm-line', '#d5dbe3'),
      colorBgLayout: cssVariable('--wm-paper', '#f6f7f9'),
      fontFamily: cssVariable('--wm-font', "system-ui, 'Waymark DejaVu', sans-serif"),
      fontSize: 14,
      borderRadius: 4,
    },
    // Text drawn in a status colour must still read at 4.5:1 (WCAG 1.4.3); borders, icons and fills keep the palette.
    components: {
      // A warning tag's words and a field's warning line in amber ink: the signal amber is 2:1 on white.
      Tag: { colorWarning: cssVariable('--wm-amber-ink', '#8a6100'), colorSuccessBg: '#ecf6f0', colorSuccessBorder: '#a9cfbb' },
      Form: { colorWarning: cssVariable('--wm-amber-ink', '#8a6100') },
      // The switch's off track carries a white "Off": the library's light grey gives it 1.8:1.
      Switch: { colorTextQuaternary: faint, colorTextTertiary: cssVariable('--wm-ink-soft', '#4a5968') },
    },
  };
}
