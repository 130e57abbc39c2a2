/**
 * What the circuit table and the phone's circuit form both offer for a circuit: the devices it
 * may hang on, the reference methods, the maximum Zs beside the measured one, and a change of
 * kind that brings its own number of legs. One place, so the two layouts never disagree.
 */
import { computed } from 'vue';
import { legsAfterKindChange } from '../../shared/schedule/legs.js';
import type { Circuit } from '../../shared/schemas/schedule.js';
import { useBoardStore } from '../stores/board.js';
import { referenceMethodOptions } from '../components/board/boardOptions.js';
import { devicePickerText } from '../components/board/deviceText.js';

/** The select shows the method's code; its option (and title) the words. */
const methodOptions = referenceMethodOptions.map((o) => ({ value: o.value, label: o.value, title: o.label }));

export function useCircuitChoices() {
  const store = useBoardStore();

  /** Breakers and the like a circuit can be fed from (not blanks or surge protection), named by their place. */
  const deviceOptions = computed(() => {
    const devices = store.working?.devices ?? [];
    return devices.filter((d) => d.kind !== 'blank' && d.kind !== 'spd').map((d) => ({ value: d.id, label: devicePickerText(d, devices) }));
  });

  /** The largest Zs the circuit's device allows (BS 7671 Table 41.3), or null while it cannot be known; the store works it out once per change. */
  function maxZs(circuit: Circuit): number | null {
    return store.maxZsById[circuit.id] ?? null;
  }

  /** A new kind brings its own number of legs (a ring two, else one) unless the legs were set by hand. */
  function setKind(circuit: Circuit, kind: unknown): void {
    if (typeof kind !== 'string') return;
    const next = kind as Circuit['kind'];
    circuit.legs = legsAfterKindChange(circuit.kind, next, circuit.legs);
    circuit.kind = next;
  }

  return { deviceOptions, methodOptions, maxZs, setKind };
}
