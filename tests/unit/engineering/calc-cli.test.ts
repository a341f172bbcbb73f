/**
 * The calc CLI: each case runs the command runner in-process (name + stdin text → stdout text + exit code);
 * one smoke test spawns `npm run --silent calc` to check the process wiring (ENGINEERING.md §8).
 */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { runCalcCli } from '@backend/cli/run-calc-cli.js';

const ROOT = path.resolve(import.meta.dirname, '../../..');

function calc(command: string, input: unknown): { status: number; body: unknown } {
  const { output, exitCode } = runCalcCli(command, JSON.stringify(input));
  return { status: exitCode, body: JSON.parse(output) };
}

const point = {
  backpressureKpa: 6.5,
  cwInletC: 22,
  cwOutletC: 31,
  cwFlowM3s: 15,
  surfaceM2: 28500,
  tubeCount: 31200,
  passes: 2,
  tubeOdMm: 25.4,
  tubeBwg: 22,
  tubeMaterial: 'titanium',
  pluggedTubes: 0,
  referenceCleanliness: 0.85,
};

describe('calc CLI', () => {
  it('saturation: one object in, the documented keys out, exit 0', () => {
    const { status, body } = calc('saturation', { pressureKpa: 8 });
    expect(status).toBe(0);
    expect(Object.keys(body as object).sort()).toEqual(['hfKjKg', 'hgKjKg', 'pressureKpa', 'temperatureC']);
    // 8 kPa condenses at 41.51 °C (IF97 region 4; steam tables give 41.51 °C)
    expect((body as { temperatureC: number }).temperatureC).toBeCloseTo(41.51, 2);
  });

  it('condenser-point: an array with one bad entry answers in place and exits 1', () => {
    const { status, body } = calc('condenser-point', [point, { ...point, cwOutletC: 20 }, { ...point, extra: 1 }]);
    expect(status).toBe(1);
    const [ok, bad, unknownKey] = body as Record<string, unknown>[];
    expect(Object.keys(ok ?? {}).sort()).toEqual([
      'cleanliness',
      'dutyMw',
      'expectedBackpressureKpa',
      'itdK',
      'lmtdK',
      'riseK',
      'saturationC',
      'ttdK',
      'uCleanWm2K',
      'uWm2K',
      'velocityMs',
    ]);
    expect(bad?.error).toMatch(/not above the inlet/);
    expect(unknownKey?.error).toMatch(/extra/);
  });

  it('penalty: money rounded to cents, the documented keys, the generic-curve warning', () => {
    const { status, body } = calc('penalty', {
      loadFraction: 1,
      ratingMw: 500,
      backpressureKpa: 10,
      referenceBackpressureKpa: 7,
      heatRateBtuKwh: 9500,
      fuelPricePerMmbtu: 3,
      replacementPricePerMwh: 60,
      co2PricePerTonne: 20,
      co2KgPerMmbtu: 93.28,
    });
    expect(status).toBe(0);
    const r = body as Record<string, number | string[]>;
    expect(Object.keys(r).sort()).toEqual(['capacityCostPerHour', 'co2CostPerHour', 'fuelCostPerHour', 'heatRatePenaltyPct', 'outputPenaltyPct', 'warnings']);
    for (const k of ['fuelCostPerHour', 'co2CostPerHour', 'capacityCostPerHour']) {
      const v = r[k] as number;
      expect(Math.abs(v * 100 - Math.round(v * 100))).toBeLessThan(1e-6);
    }
    expect(r.warnings).toEqual(["correction curve: generic — replace with the turbine maker's curve"]);
  });

  it('condenser-point: warns of a cleanliness outside 0.2–1.3 and refuses an expected backpressure above 50 kPa', () => {
    const { status, body } = calc('condenser-point', [
      { ...point, uCleanWm2K: 500 },
      { ...point, uCleanWm2K: 300 },
    ]);
    expect(status).toBe(1);
    const [warned, refused] = body as { warnings?: string[]; error?: string }[];
    expect(warned?.warnings).toEqual([expect.stringMatching(/cleanliness 3\.77 is outside 0\.2–1\.3/)]);
    expect(refused?.error).toMatch(/expected backpressure at cleanliness 0\.85 is 117\.\d kPa, outside 0\.7–50 kPa/);
  });

  it("penalty: warns beyond the correction curve's last point and refuses a backpressure above 50 kPa", () => {
    const input = {
      loadFraction: 1,
      ratingMw: 300,
      referenceBackpressureKpa: 7,
      heatRateBtuKwh: 9500,
      fuelPricePerMmbtu: 3,
      replacementPricePerMwh: 60,
      co2PricePerTonne: 0,
      co2KgPerMmbtu: 53.06,
    };
    const { status, body } = calc('penalty', [
      { ...input, backpressureKpa: 20 },
      { ...input, backpressureKpa: 4035 },
    ]);
    expect(status).toBe(1);
    const [beyond, refused] = body as { warnings?: string[]; error?: string }[];
    expect(beyond?.warnings).toContainEqual(expect.stringMatching(/20 kPa is beyond the correction curve's last point/));
    expect(refused?.error).toMatch(/backpressureKpa must be 0\.7–50 kPa/);
  });

  it('an unknown command and bad JSON give an error object and exit 1', () => {
    const unknown = calc('no-such-command', {});
    expect(unknown.status).toBe(1);
    expect((unknown.body as { error: string }).error).toMatch(/unknown command "no-such-command"; one of: saturation, /);
    const bad = runCalcCli('saturation', '{oops');
    expect(bad.exitCode).toBe(1);
    expect(JSON.parse(bad.output)).toEqual({ error: 'stdin is not valid JSON' });
  });

  it('as a process (`npm run --silent calc`): reads stdin, prints one JSON line, exits 1 when an input failed', () => {
    const r = spawnSync('npm', ['run', '--silent', 'calc', '--', 'saturation'], {
      cwd: ROOT,
      input: JSON.stringify([{ pressureKpa: 8 }, { pressureKpa: 'eight' }]),
      encoding: 'utf8',
      timeout: 60_000,
    });
    expect(r.status).toBe(1);
    expect(r.stdout.trim().split('\n')).toHaveLength(1);
    const [ok, bad] = JSON.parse(r.stdout) as [{ temperatureC: number }, { error: string }];
    expect(ok.temperatureC).toBeCloseTo(41.51, 2);
    expect(bad.error).toMatch(/pressureKpa/);
  });
});
