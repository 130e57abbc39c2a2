/**
 * Words the editor shows for the schedule's coded values, in the trade's terms, and the
 * option lists of its selects. One place, so the table, the drawers and the forms agree.
 */
import {
  alternativeSupplyKinds,
  breakerCurves,
  cableTypes,
  circuitKinds,
  deviceKinds,
  earthingArrangements,
  installationTypes,
  phases,
  rcdTypes,
  referenceMethods,
  type CableType,
  type CircuitKind,
  type DeviceKind,
  type InstallationType,
} from '../../../shared/schemas/schedule.js';

type Option<T extends string | number> = { value: T; label: string };
const options = <T extends string>(values: readonly T[], names: Record<T, string>): Option<T>[] => values.map((value) => ({ value, label: names[value] }));

export const installationTypeNames: Record<InstallationType, string> = {
  domestic: 'Domestic',
  'rented-domestic': 'Rented domestic',
  hmo: 'HMO / residential accommodation',
  commercial: 'Commercial',
  industrial: 'Industrial',
  caravan: 'Caravan',
  'caravan-park': 'Caravan park',
  agricultural: 'Agricultural / horticultural',
  'swimming-pool': 'Swimming pool',
  marina: 'Marina',
  'petrol-station': 'Petrol filling station',
  'leisure-complex': 'Leisure complex',
  'special-location': 'Other special location',
  'construction-site': 'Construction site',
};
export const circuitKindNames: Record<CircuitKind, string> = {
  ring: 'Ring final',
  radial: 'Radial',
  lighting: 'Lighting',
  cooker: 'Cooker',
  shower: 'Shower',
  immersion: 'Immersion heater',
  'fixed-appliance': 'Fixed appliance',
  'sub-main': 'Sub-main',
  other: 'Other',
};
export const cableTypeNames: Record<CableType, string> = {
  'twin-earth': 'Flat twin and earth',
  swa: 'SWA',
  'singles-conduit': 'Singles in conduit',
  flex: 'Flex',
  other: 'Other',
};
export const deviceKindNames: Record<DeviceKind, string> = {
  'main-switch': 'Main switch',
  rcd: 'RCD',
  rcbo: 'RCBO',
  mcb: 'MCB',
  fuse: 'Fuse',
  afdd: 'AFDD',
  spd: 'SPD',
  isolator: 'Isolator',
  timer: 'Timer/contactor',
  blank: 'Blank',
};
const alternativeSupplyNames = { pv: 'Solar PV', battery: 'Battery storage', generator: 'Generator', wind: 'Wind turbine', other: 'Other' } as const;
const referenceMethodNames: Record<(typeof referenceMethods)[number], string> = {
  A: 'A – enclosed in insulated wall',
  B: 'B – enclosed on a wall',
  C: 'C – clipped direct',
  D: 'D – in the ground',
  E: 'E – free air, multicore',
  F: 'F – free air, single-core',
  100: '100 – above plasterboard, joists, ≤100 mm insulation',
  101: '101 – above plasterboard, >100 mm insulation',
  102: '102 – in stud wall, touching inner wall',
  103: '103 – in stud wall, not touching',
};

export const earthingOptions = earthingArrangements.map((value) => ({ value, label: value }));
export const installationTypeOptions = options(installationTypes, installationTypeNames);
export const circuitKindOptions = options(circuitKinds, circuitKindNames);
export const cableTypeOptions = options(cableTypes, cableTypeNames);
export const deviceKindOptions = options(deviceKinds, deviceKindNames);
export const alternativeSupplyOptions = options(alternativeSupplyKinds, alternativeSupplyNames);
export const referenceMethodOptions = referenceMethods.map((value) => ({ value, label: referenceMethodNames[value] }));
export const curveOptions = breakerCurves.map((value) => ({ value, label: value }));
export const rcdTypeOptions = rcdTypes.map((value) => ({ value, label: `Type ${value}` }));
export const phaseOptions = phases.map((value) => ({ value, label: value }));

/** Common conductor sizes (mm²) offered first; any other size can still be typed. */
export const commonCsa = [1, 1.5, 2.5, 4, 6, 10, 16, 25, 35];
