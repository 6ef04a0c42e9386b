/**
 * The JSON Schema (draft 2020-12) of the scenario file kinds (spacecraft, network, booking rules), generated from the zod
 * schemas (zod 4 `z.toJSONSchema`), so the field reference cannot drift from what
 * `check` accepts. Field names, types, enums, patterns and number bounds are in it; the
 * "exactly one of" rules and cross-field checks (a TLE's checksum, an IANA zone) are
 * only in `passbudget check`.
 */
import { z } from 'zod';
import { networkFileSchema, spacecraftFileSchema } from './schema.js';
import { bookingFileSchema } from './booking.js';

export type SchemaKind = 'spacecraft' | 'network' | 'booking';
export const SCHEMA_KINDS: readonly SchemaKind[] = ['spacecraft', 'network', 'booking'];

const TITLES: Record<SchemaKind, string> = {
  spacecraft: 'passbudget spacecraft file (what flies)',
  network: 'passbudget network file (where it lands)',
  booking: 'passbudget booking rules file (plan --booking)',
};
const SCHEMAS = { spacecraft: spacecraftFileSchema, network: networkFileSchema, booking: bookingFileSchema } as const;

/** The JSON Schema of one file kind. */
export function jsonSchemaOf(kind: SchemaKind): Record<string, unknown> {
  const out = z.toJSONSchema(SCHEMAS[kind], { io: 'input', unrepresentable: 'any' }) as Record<string, unknown>;
  const { $schema, ...rest } = out;
  return { $schema, title: TITLES[kind], ...rest };
}

/** Every kind in one document: any of the files validates against it. */
export function jsonSchemaOfBoth(): Record<string, unknown> {
  const strip = (s: Record<string, unknown>) => {
    const { $schema: _s, ...rest } = s;
    return rest;
  };
  return {
    $schema: 'https://json-schema.org/draft/2020-12/schema',
    title: 'passbudget scenario file (spacecraft, network or booking rules)',
    anyOf: [{ $ref: '#/$defs/spacecraft_file' }, { $ref: '#/$defs/network_file' }, { $ref: '#/$defs/booking_file' }],
    $defs: {
      spacecraft_file: strip(jsonSchemaOf('spacecraft')),
      network_file: strip(jsonSchemaOf('network')),
      booking_file: strip(jsonSchemaOf('booking')),
    },
  };
}
