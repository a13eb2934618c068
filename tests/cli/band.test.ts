import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { bandCommand } from '../../src/cli/commands/band.ts';
import type { CommandIO } from '../../src/cli/command.ts';

const fixtures = 'tests/fixtures/devices';

async function run(args: string[], readText: CommandIO['readText'] = (path) => readFileSync(path, 'utf8')) {
  const out: string[] = [];
  const err: string[] = [];
  const io: CommandIO = {
    stdout: (text) => void out.push(text),
    stderr: (text) => void err.push(text),
    readText,
    writeFile: () => undefined,
  };
  try {
    const code = await bandCommand.run(args, io);
    return { code, stdout: out.join(''), stderr: err.join('') };
  } catch (error) {
    // The dispatcher prints an InputError's one line and exits 2; do the same here.
    return { code: 2, stdout: out.join(''), stderr: `${(error as Error).message}\n` };
  }
}

describe('discern band', () => {
  it('has the expected defaults', () => {
    expect(bandCommand.verb).toBe('band');
    expect(bandCommand.help).toMatch(/--amps/);
  });

  it('band prints a relay device file in primary amperes, "no operation" below pickup', async () => {
    const { code, stdout } = await run([`${fixtures}/feeder-relay.json`, '--amps', '500,6000,10 kA']);
    expect(code).toBe(0);
    expect(stdout).toMatch(/^R-F1 \(relay\)\n/);
    expect(stdout).toMatch(/current A primary at the device's own voltage\s+minTime s\s+maxTime s/);
    expect(stdout).toMatch(/\s500\s+no operation\s+no operation\n/);
    // IEEE C37.112 VI, CT 600:5, tap 5 A, TD 2 at 6000 A: 2 · (19.61/99 + 0.491) = 1.37816 s; +5 cycles breaker.
    expect(stdout).toMatch(/6 000\s+1\.37816\s+1\.46149\n/);
    expect(stdout).toMatch(/10 000\s+0\.0166667\s+0\.1\n/);
  });

  it('band --json gives null where the device does not operate', async () => {
    const { code, stdout } = await run([`${fixtures}/illustrative-fuse.json`, '--amps', '100,400', '--json']);
    expect(code).toBe(0);
    const json = JSON.parse(stdout);
    expect(json.kind).toBe('fuse');
    expect(json.volts).toBeNull();
    expect(json.ampsAre).toBe("amperes at the device's own voltage");
    expect(json.rows).toEqual([
      { amps: 100, minTime: null, maxTime: null },
      { amps: 400, minTime: 10, maxTime: 12 },
    ]);
    expect(json.diagnostics[0]).toMatch(/illustrative/);
  });

  it('band picks a device of a study with --device', async () => {
    const { code, stdout } = await run([
      `${fixtures}/two-device-study.json`,
      '--device',
      'MAIN',
      '--amps',
      '1200,8000',
    ]);
    expect(code).toBe(0);
    expect(stdout).toMatch(/^MAIN \(trip-unit\)\n/);
    expect(stdout).toMatch(/current A at 480 V\s+minTime s/); // the bus SWBD it feeds
    expect(stdout).toMatch(/1 200\s+144\s+192\n/); // long time 10 s at 6 × 800 A with −10/+20 %: 9 · (4800/1200)², 12 · (4800/1200)² (computed)
    expect(stdout).toMatch(/8 000\s+0\.3\s+0\.35\n/);
  });

  it('band rejects bad input with one line naming the flag or field', async () => {
    const cases: Array<[string[], RegExp]> = [
      [
        [`${fixtures}/two-device-study.json`, '--amps', '100'],
        /^--device: expected one of "MAIN", "F1", got nothing\n$/,
      ],
      [
        [`${fixtures}/two-device-study.json`, '--device', 'X', '--amps', '100'],
        /^--device: expected one of "MAIN", "F1", got "X"\n$/,
      ],
      [
        [`${fixtures}/feeder-relay.json`, '--amps', '100,abc'],
        /^--amps: expected currents between 0\.001 A and 10000000 A separated by commas, got "abc"\n$/,
      ],
      [
        [`${fixtures}/feeder-relay.json`, '--amps', '-5'],
        /^--amps: expected currents between 0\.001 A and 10000000 A separated by commas, got "-5"\n$/,
      ],
      [
        [`${fixtures}/feeder-relay.json`, '--amps', '100,1e-310'],
        /^--amps: expected currents between 0\.001 A and 10000000 A separated by commas, got "1e-310"\n$/,
      ],
      [
        [`${fixtures}/feeder-relay.json`, '--amps', '20 MA'],
        /^--amps: expected currents between 0\.001 A and 10000000 A separated by commas, got "20 MA"\n$/,
      ],
      [[`${fixtures}/feeder-relay.json`], /^--amps: expected currents in amperes separated by commas, got nothing\n$/],
      [
        [`${fixtures}/feeder-relay.json`, '--device', 'R', '--amps', '1'],
        /^--device: expected a study file to pick from, got "R"\n$/,
      ],
      [
        [`${fixtures}/missing.json`, '--amps', '1'],
        /^tests\/fixtures\/devices\/missing\.json: expected a readable device or study file/,
      ],
      [['--amps', '1'], /^band: expected a device or study file, got nothing\n$/],
    ];
    for (const [args, message] of cases) {
      const { code, stderr } = await run(args);
      expect(code, args.join(' ')).toBe(2);
      expect(stderr).toMatch(message);
    }
  });

  it('band names a file that is not a JSON object as the study when --device picks from it, else as the device', async () => {
    const cases: Array<[string, string[], RegExp]> = [
      ['', ['--device', 'MAIN'], /^study: expected a JSON object at line 1:1, got the end of the text\n$/],
      ['', [], /^device: expected a JSON object at line 1:1, got the end of the text\n$/],
      ['3', ['--device', 'MAIN'], /^study: expected a JSON object, got "3"\n$/],
      ['[]', [], /^device: expected a JSON object, got \[\]\n$/],
    ];
    for (const [text, flags, message] of cases) {
      const { code, stderr } = await run(['given.json', ...flags, '--amps', '100'], () => text);
      expect(code, JSON.stringify(text)).toBe(2);
      expect(stderr).toMatch(message);
    }
  });

  it('band reports a bad characteristic with its path', async () => {
    const { stderr } = await run(['tests/fixtures/devices/bad-relay.json', '--amps', '1']);
    expect(stderr).toMatch(
      /^device\.characteristic\.timeOvercurrent\.timeDial: expected a time dial for curve "ieee-very-inverse", got nothing\n$/,
    );
  });
});
