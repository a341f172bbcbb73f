/** `calc saturation`: saturation state from a pressure or a temperature (IAPWS-IF97 region 4). */
import type { CalcCommand } from '../run-calc.js';
import { calcSaturationInput, calcSaturationOutput, type CalcSaturationOutput } from '@shared/schemas/calc-saturation.js';
import { saturationPressureKpa, saturationTemperatureC, saturatedLiquidEnthalpyKjKg, saturatedVapourEnthalpyKjKg } from '@shared/domain/steam/index.js';

const command: CalcCommand = {
  input: calcSaturationInput,
  output: calcSaturationOutput,
  run(input: unknown): CalcSaturationOutput {
    const v = calcSaturationInput.parse(input);
    const temperatureC = v.pressureKpa !== undefined ? saturationTemperatureC(v.pressureKpa) : v.temperatureC!;
    const pressureKpa = v.pressureKpa !== undefined ? v.pressureKpa : saturationPressureKpa(temperatureC);
    return {
      pressureKpa,
      temperatureC,
      hfKjKg: saturatedLiquidEnthalpyKjKg(temperatureC),
      hgKjKg: saturatedVapourEnthalpyKjKg(temperatureC),
    };
  },
};

export default command;
