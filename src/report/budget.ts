/** Renders one link budget term by term, like a handbook budget. */
import type { SingleBudget } from '../plan/single.js';
import { fixed, renderTable } from './table.js';
import { climateHeading, renderClimateInputs } from './climate.js';

/** A number at ten significant digits, without a negative zero. */
function significant(v: number): number {
  const r = Number(v.toPrecision(10));
  return r === 0 ? 0 : r;
}

function decimalsFor(unit: string): number {
  if (unit === 'bit/s' || unit === 'baud' || unit === 'Hz') return 0;
  if (unit === 'km' || unit === 'K' || unit === 'MHz') return 1;
  return 2;
}

export function renderBudgetTable(b: SingleBudget): string {
  const rows = b.terms.map((t) => [t.name, fixed(t.value, decimalsFor(t.unit)), t.unit, t.source]);
  const head = `Link budget: ${b.spacecraftId} radio ${b.radioId} -> ${b.stationId} at ${b.look.elevationDeg.toFixed(2)} deg elevation, ${b.look.rangeKm.toFixed(1)} km`;
  const c = b.climate;
  const climate = `${climateHeading(c.exceedancePercent, c.gasCloudExceedancePercent)}, station ${b.stationId}\n${renderClimateInputs(c.inputs)}`;
  return `${head}\n\n${renderTable([{ header: 'term' }, { header: 'value', align: 'right' }, { header: 'unit' }, { header: 'source' }], rows)}\n\n${climate}\n`;
}

export function renderBudgetJson(b: SingleBudget): string {
  const doc = {
    spacecraft: b.spacecraftId,
    station: b.stationId,
    radio: b.radioId,
    elevation_deg: Number(b.look.elevationDeg.toFixed(6)),
    range_km: Number(b.look.rangeKm.toFixed(6)),
    // ten significant digits: no 44530269.99999999, no -0
    terms: b.terms.map((t) => ({ name: t.name, value: significant(t.value), unit: t.unit, source: t.source })),
    climate: b.climate.inputs.map((i) => ({ field: i.fileField, name: i.label, value: significant(i.value), unit: i.unit, source: i.source })),
  };
  return JSON.stringify(doc, null, 2) + '\n';
}
