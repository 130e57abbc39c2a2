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
  return {
    token: {
      colorPrimary: navy,
      colorLink: navy,
      colorWarning: cssVariable('--wm-amber', '#f2a900'),
      colorError: cssVariable('--wm-danger', '#b42318'),
      colorSuccess: cssVariable('--wm-ok', '#1f7a4d'),
      colorText: cssVariable('--wm-ink', '#14202b'),
      colorBorder: cssVariable('--wm-line', '#d5dbe3'),
      colorBgLayout: cssVariable('--wm-paper', '#f6f7f9'),
      fontFamily: cssVariable('--wm-font', "'DejaVu Sans', system-ui, sans-serif"),
      fontSize: 14,
      borderRadius: 4,
    },
  };
}
