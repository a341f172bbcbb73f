export {
  saturationPressureKpa,
  saturationTemperatureC,
  saturationPressureMpa,
  saturationTemperatureK,
  CRITICAL_PRESSURE_MPA,
  CRITICAL_TEMPERATURE_K,
} from './if97-region4.js';
export { region1, region1TemperatureFromPh, R_KJ_KGK, type SteamProperties } from './if97-region1.js';
export { region2, b23PressureMpa } from './if97-region2.js';
export { liquidDensityKgM3, liquidCpKjKgK, COOLING_WATER_PRESSURE_MPA } from './cooling-water-properties.js';
export { saturatedLiquidEnthalpyKjKg, saturatedVapourEnthalpyKjKg } from './saturated-states.js';
