/** `passbudget schema` and `passbudget codes`: references generated from the program itself. */
import { Option, type Command } from 'commander';
import { UsageError } from '../errors.js';
import { jsonSchemaOf, jsonSchemaOfBoth, SCHEMA_KINDS, type SchemaKind } from '../scenario/json-schema.js';
import { codeRows, renderCodesJson, renderCodesTable } from '../report/codes.js';
import type { CliIo } from './io.js';
import type { SetExit } from './commands.js';
import { withExamples } from './options.js';

export function registerReference(program: Command, io: CliIo, setExit: SetExit): void {
  withExamples(
    program
      .command('schema')
      .description('the JSON Schema (draft 2020-12) of a spacecraft, network or booking-rules file, generated from the checks `check` runs; every kind without an argument')
      .argument('[kind]', `file kind: ${SCHEMA_KINDS.join(', ')} (default: one schema that accepts any of them)`),
    [
      ['passbudget schema spacecraft > spacecraft.schema.json', 'the spacecraft-file schema, for an editor\'s YAML / JSON language server'],
      ['passbudget schema network > network.schema.json', 'the network-file schema'],
      ['passbudget schema booking > booking.schema.json', 'the booking-rules file schema (plan --booking)'],
      ['passbudget schema', 'one schema that accepts any kind'],
    ],
  ).action((kind: string | undefined) => {
    if (kind !== undefined && !(SCHEMA_KINDS as readonly string[]).includes(kind)) {
      throw new UsageError(`schema: "${kind}" is not a file kind; valid: ${SCHEMA_KINDS.join(', ')}`);
    }
    const doc = kind === undefined ? jsonSchemaOfBoth() : jsonSchemaOf(kind as SchemaKind);
    io.out(JSON.stringify(doc, null, 2) + '\n');
    setExit(0);
  });

  withExamples(
    program
      .command('codes')
      .description('every MODCOD and code a radio\'s coding may name, with its threshold, efficiency and source')
      .addOption(new Option('--format <format>', 'output format').choices(['table', 'json']).default('table')),
    [
      ['passbudget codes', 'the DVB-S2, DVB-S2X and CCSDS entries as a table'],
      ['passbudget codes --format json', 'the same as JSON'],
      ['passbudget codes | grep "QPSK 1/2"', 'one entry'],
    ],
  ).action((raw: { format: 'table' | 'json' }) => {
    const rows = codeRows();
    io.out(raw.format === 'json' ? renderCodesJson(rows) : renderCodesTable(rows));
    setExit(0);
  });
}
