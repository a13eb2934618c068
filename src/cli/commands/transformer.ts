import { CAUTION } from '../../engine/caution.ts';
import { expectedGot, InputError } from '../../engine/errors.ts';
import { transformerCalculation, type TransformerCalculationInput } from '../../engine/fault/index.ts';
import { formatAmps, formatVolts, significant } from '../../engine/quantity/index.ts';
import { formatWork } from '../../engine/work.ts';
import { parseArgs, percentFlag, positiveFlag, quantityFlag, requiredFlag, flagText } from '../args.ts';
import type { Command } from '../command.ts';

const FLAGS = {
  kva: 'value',
  primary: 'value',
  secondary: 'value',
  impedance: 'value',
  phases: 'value',
  xr: 'value',
  'source-mva': 'value',
  'source-ka': 'value',
  'source-xr': 'value',
  'primary-connection': 'value',
  'secondary-winding': 'value',
  json: 'switch',
  help: 'switch',
} as const;

/** The least nameplate impedance taken, as a study's transformer takes it (%). */
const MIN_IMPEDANCE_PERCENT = 0.5;
const HELP = `discern transformer — full-load current and secondary bolted fault of one transformer

  --kva <rating>          rating; a plain number is kVA ("1500", "1.5 MVA")
  --primary <voltage>     primary line-to-line voltage; a plain number is volts ("12470", "12.47 kV")
  --secondary <voltage>   secondary line-to-line voltage ("480", "480 V")
  --impedance <percent>   nameplate impedance ("5.75", "5.75 %")
  --phases 1|3            single- or three-phase (default 3)
  --xr <ratio>            transformer X/R (default: all reactance)
  --source-mva <power>    available three-phase fault at the primary, MVA (default: infinite source)
  --source-ka <current>   or the same as a current, kA
  --source-xr <ratio>     source X/R (default: all reactance)
  --primary-connection line-to-line|line-to-neutral
                          single-phase units: primary across two lines (default) or line to neutral
                          (then --primary is the winding voltage, e.g. 7.2 kV on a 12.47 kV system)
  --secondary-winding centre-tapped|two-wire
                          single-phase units: default centre-tapped for a 240 V secondary (120/240 V)
  --json                  print the result and its work as JSON

Example: discern transformer --kva 1500 --primary "12.47 kV" --secondary 480 --impedance 5.75 --xr 6 --source-mva 250 --source-xr 12
`;

/**
 * `discern transformer`: the quick calculation of DEVELOPERS.md, command line — full-load amps on both sides, the
 * infinite-bus and finite-source secondary fault, its primary-reflected value, and the work.
 *
 * @example await transformerCommand.run(['--kva', '1500', '--primary', '12.47 kV', '--secondary', '480', '--impedance', '5.75'], io)
 */
export const transformerCommand: Command = {
  verb: 'transformer',
  summary: 'full-load amps and secondary fault current of one transformer, with the work',
  help: HELP,
  async run(args, io) {
    const parsed = parseArgs(args, FLAGS);
    if (parsed.flags.has('help')) {
      io.stdout(HELP);
      return 0;
    }
    if (parsed.positionals.length > 0)
      throw new InputError('transformer', expectedGot('flags only', parsed.positionals[0]));
    const input = inputOf(parsed);
    const result = transformerCalculation(input);
    if (parsed.flags.has('json')) {
      io.stdout(`${JSON.stringify({ input, ...result }, null, 2)}\n`);
      return 0;
    }
    const phases = input.phases === 1 ? 'single-phase' : 'three-phase';
    const lines = [
      `Transformer ${significant(input.rating / 1000, 6)} kVA ${phases}, ${formatVolts(input.primary)} to ${formatVolts(input.secondary)}, ${significant(input.impedance, 6)} %Z`,
      `Source: ${input.source ? (input.source.va !== undefined ? `${significant(input.source.va / 1e6, 6)} MVA` : formatAmps(input.source.amps)) : 'infinite'}`,
      '',
      `Full-load current     primary ${formatAmps(result.fullLoadAmps.primary)}   secondary ${formatAmps(result.fullLoadAmps.secondary)}`,
      `Secondary fault (bolted, symmetrical RMS)`,
      `  infinite source     ${formatAmps(result.faultAmps.infiniteBus)}`,
      `  with this source    ${formatAmps(result.faultAmps.secondary)}   X/R ${significant(result.xr, 4)}`,
      `  seen at the primary ${formatAmps(result.faultAmps.reflectedToPrimary)}`,
      ...(result.faultAmps.lineToNeutral !== undefined
        ? [
            `  line to neutral     ${formatAmps(result.faultAmps.lineToNeutral)}   (half winding at ${formatVolts(input.secondary / 2)}; 1.5 × R and 1.2 × X, common practice)`,
          ]
        : []),
      '',
      'Work',
      formatWork(result.work),
      '',
      CAUTION,
      '',
    ];
    io.stdout(lines.join('\n'));
    return 0;
  },
};

function inputOf(parsed: ReturnType<typeof parseArgs>): TransformerCalculationInput {
  const rating = quantityFlag(
    requiredFlag(parsed, 'kva', 'a transformer rating such as "1500" (kVA)'),
    'kva',
    'power',
    'kVA',
    'a rating greater than 0 such as "1500" or "1.5 MVA"',
  );
  const voltage = (name: 'primary' | 'secondary') =>
    quantityFlag(
      requiredFlag(parsed, name, `a ${name} voltage such as "480" or "12.47 kV"`),
      name,
      'voltage',
      'V',
      'a voltage greater than 0 such as "480" or "12.47 kV"',
    );
  const primary = voltage('primary');
  const secondary = voltage('secondary');
  const impedanceText = requiredFlag(parsed, 'impedance', 'a percentage such as "5.75"');
  const impedance = percentFlag(impedanceText, 'impedance');
  // As a study's transformer: a per-unit 0.0575 read as 0.0575 % would give a hundred times the fault current.
  if (impedance < MIN_IMPEDANCE_PERCENT)
    throw new InputError(
      '--impedance',
      expectedGot(`a percentage of at least ${MIN_IMPEDANCE_PERCENT} (a per-unit 0.0575 is 5.75)`, impedanceText),
    );
  const phasesText = flagText(parsed, 'phases') ?? '3';
  if (phasesText !== '1' && phasesText !== '3') throw new InputError('--phases', expectedGot('1 or 3', phasesText));
  const optional = (name: 'xr' | 'source-xr') => {
    const text = flagText(parsed, name);
    return text === undefined ? undefined : positiveFlag(text, name, 'an X/R ratio greater than 0');
  };
  const mva = flagText(parsed, 'source-mva');
  const ka = flagText(parsed, 'source-ka');
  if (mva !== undefined && ka !== undefined)
    throw new InputError('--source-ka', expectedGot('either --source-mva or --source-ka', 'both'));
  const source =
    mva !== undefined
      ? { va: quantityFlag(mva, 'source-mva', 'power', 'MVA', 'an available fault greater than 0 such as "250" (MVA)') }
      : ka !== undefined
        ? {
            amps: quantityFlag(
              ka,
              'source-ka',
              'current',
              'kA',
              'an available fault greater than 0 such as "11.6" (kA)',
            ),
          }
        : undefined;
  const sourceXr = optional('source-xr');
  if (sourceXr !== undefined && !source)
    throw new InputError('--source-xr', expectedGot('--source-mva or --source-ka with it', `--source-xr ${sourceXr}`));
  const connection = flagText(parsed, 'primary-connection');
  if (connection !== undefined && connection !== 'line-to-line' && connection !== 'line-to-neutral')
    throw new InputError('--primary-connection', expectedGot('line-to-line or line-to-neutral', connection));
  const winding = flagText(parsed, 'secondary-winding');
  if (winding !== undefined && winding !== 'centre-tapped' && winding !== 'two-wire')
    throw new InputError('--secondary-winding', expectedGot('centre-tapped or two-wire', winding));
  if ((connection !== undefined || winding !== undefined) && phasesText !== '1')
    throw new InputError(
      connection !== undefined ? '--primary-connection' : '--secondary-winding',
      expectedGot('--phases 1 with it', `--phases ${phasesText}`),
    );
  return {
    rating,
    primary,
    secondary,
    impedance,
    phases: phasesText === '1' ? 1 : 3,
    ...(connection ? { primaryConnection: connection } : {}),
    ...(winding ? { centreTapped: winding === 'centre-tapped' } : {}),
    xr: optional('xr'),
    source,
    sourceXr,
  };
}
