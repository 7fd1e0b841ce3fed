import { METAL_FILMS } from '@rhotrace/api-types';

/** Closing line of every list: these notes never replace the lab's own rules. */
export const DEFER_TO_LAB_RULES =
  "These notes are reminders, not a procedure: your lab's own safety rules, training and the " +
  'instructions of licensed staff come first. If in doubt, stop and ask.';

export const HOT_CHUCK =
  'Hot chuck: a heated stage stays hot long after the sweep ends. Check its temperature before ' +
  'touching the wafer or probes, handle with tweezers, and never leave a hot stage unattended.';
export const CRYOGEN =
  'Cryogens: wear a face shield and cryogenic gloves when filling or handling liquid nitrogen or ' +
  'helium, keep the room ventilated (boil-off displaces oxygen), and never seal a cold vessel.';
export const TOXIC_COMPOUND = (material: string) =>
  `Toxic compound semiconductor: ${material} contains arsenic. An intact wafer is safe to ` +
  'handle with gloves, but if it breaks, chips or is scratched, do not sweep or blow the ' +
  "fragments: collect them wet, keep the dust out of the air, and follow the lab's hazardous " +
  'waste rules.';
export const PROBE_HEATING =
  'Probe current heats thin films: start with a small current and raise it only as far as the ' +
  'signal needs. Self-heating at the probe tips shifts the reading and can burn through a film.';
/** Strong magnets of a Hall setup (the field itself and what it pulls). */
export const MAGNET =
  'Strong magnet (Hall measurement): keep people with pacemakers or other implants out of the ' +
  'marked field zone, keep loose steel tools, gas cylinders and chairs away from the magnet, and ' +
  'leave cards, watches and phones outside; switch an electromagnet down slowly.';
const SHARP =
  'Wafer edges and shards are sharp and brittle: handle by the edge with wafer tweezers and keep ' +
  'broken pieces in a labelled container.';

const metals: readonly string[] = METAL_FILMS;

/**
 * The safety cautions that fit a task on a wafer of `material`, chosen from the task's wording
 * (heating, cryogenic work, current, a Hall measurement's magnet) and the material (arsenic
 * compounds, thin metal films).
 * Always ends with the reminder that the lab's own rules come first.
 */
export function safetyCautionsFor(material: string, task: string): string[] {
  const text = task.toLowerCase();
  const cautions: string[] = [];
  const mentionsKelvin = [...text.matchAll(/(\d+(?:\.\d+)?)\s*k\b/g)].map((m) => Number(m[1]));
  const mentionsCelsius = [...text.matchAll(/(-?\d+(?:\.\d+)?)\s*°?\s*c\b/g)].map((m) =>
    Number(m[1]),
  );
  const sweep = /sweep|r\s*\(\s*t\s*\)|resistivity|temperature|anneal|bake/.test(text);
  const hot =
    /heat|hot|anneal|bake|high[- ]temp/.test(text) ||
    mentionsKelvin.some((k) => k > 330) ||
    mentionsCelsius.some((c) => c > 55);
  const cold =
    /cryo|liquid nitrogen|\bln2\b|\blhe\b|helium|cool|cold|low[- ]temp/.test(text) ||
    mentionsKelvin.some((k) => k < 250) ||
    mentionsCelsius.some((c) => c < -20);
  if (hot || (sweep && !cold)) cautions.push(HOT_CHUCK);
  if (cold) cautions.push(CRYOGEN);
  if (/gaas|arsenic|inas|algaas/i.test(material)) cautions.push(TOXIC_COMPOUND(material));
  if (metals.includes(material) || /film|current/.test(text)) {
    cautions.push(PROBE_HEATING);
  }
  if (/\bhall\b|magnet|\bb[- ]?field|tesla/.test(text)) cautions.push(MAGNET);
  cautions.push(SHARP);
  cautions.push(DEFER_TO_LAB_RULES);
  return cautions;
}
