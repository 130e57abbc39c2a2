/**
 * What an images request is drawn for: the resolution (`dpi=`, else the profile's, else the usual
 * 180 dpi) and, from a printer profile (`profile=<id>`, one of the caller's organisation's; another's
 * is 404), each tape's printable band and the end margin the printer leaves.
 */
import type { AppContext } from '../context.js';
import type { CurrentUser } from '../http/context.js';
import type { TapeSettings } from '../pdf/index.js';
import { tapeWidths } from '../../shared/schemas/print.js';
import type { PrinterProfileRecord } from '../../shared/schemas/printer-profile.js';
import { getProfile } from '../printer-profiles/service.js';
import { DEFAULT_DPI, type PrinterSetup } from './images.js';

/** A profile's bands and end margin as the engine's tape settings (every width gets the margin). */
export function tapeSettingsOf(profile: PrinterProfileRecord): TapeSettings {
  const settings: TapeSettings = {};
  for (const w of tapeWidths) {
    const band = profile.bands[String(w)];
    settings[w] = band === undefined ? { marginMm: profile.endMarginMm } : { printableMm: band, marginMm: profile.endMarginMm };
  }
  return settings;
}

export async function printerSetupFor(ctx: AppContext, user: CurrentUser, query: { dpi?: number; profileId?: number }): Promise<PrinterSetup> {
  if (query.profileId === undefined) return { dpi: query.dpi ?? DEFAULT_DPI, tape: {} };
  const profile = await getProfile(ctx.db, user.organisationId, query.profileId);
  return { dpi: query.dpi ?? profile.dpi, tape: tapeSettingsOf(profile) };
}
