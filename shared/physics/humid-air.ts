/**
 * Humid air: how much water the air holds and what that does to its density and gas constant
 * (ASHRAE Handbook Fundamentals 2017, ch. 1, through psychrolib). The air an engine breathes is
 * dry air plus water vapour; the vapour takes up room in every cubic metre but burns no fuel, so
 * fuel and power follow the dry air alone.
 *
 * Per kg of dry air the charge holds W kg of water (the humidity ratio). The mixture's gas
 * constant is R = R_a·(1 + W/ε)/(1 + W), with ε = M_w/M_a = 0.621945 (ASHRAE 2017 ch. 1 eq. 20),
 * so a cubic metre at a pressure and temperature holds less mass than dry air would; its specific
 * heat cp = (cp_a + W·cp_w)/(1 + W) with cp_w = 1.86 kJ/(kg K), the vapour term of ASHRAE's moist
 * air enthalpy (eq. 32); γ = cp/(cp − R). At W = 0 all three are exactly dry air's.
 */
import psychrolib from 'psychrolib';
import { AIR_CP, AIR_GAMMA, AIR_GAS_CONSTANT } from './gas';

/** Ratio of the molar masses of water and dry air, M_w/M_a (ASHRAE Handbook Fundamentals 2017, ch. 1, eq. 20). */
export const WATER_TO_AIR_MOLAR_MASS = 0.621945;
/** Specific heat of water vapour at constant pressure, J/(kg·K) (ASHRAE 2017 ch. 1 eq. 32: h_g = 2501 + 1.86·t kJ/kg). */
export const WATER_VAPOUR_CP = 1860;

/** The gas properties of a charge: dry air, or humid air of a humidity ratio. */
export interface ChargeGas {
  /** Humidity ratio W, kg of water per kg of dry air (0 for dry air). */
  humidityRatio: number;
  /** Specific gas constant of the mixture, J/(kg·K). */
  gasConstant: number;
  /** Specific heat at constant pressure of the mixture, J/(kg·K). */
  cp: number;
  /** Ratio of specific heats of the mixture. */
  gamma: number;
}

/** Dry air: ISO 2533's gas constant, γ 1.4 and the cp that agrees with them (gas.ts). */
export const DRY_AIR: ChargeGas = { humidityRatio: 0, gasConstant: AIR_GAS_CONSTANT, cp: AIR_CP, gamma: AIR_GAMMA };

function useSi(): void {
  if (psychrolib.GetUnitSystem() !== psychrolib.SI) psychrolib.SetUnitSystem(psychrolib.SI);
}

/**
 * Saturation vapour pressure of water over a flat surface of water (or ice below the triple
 * point), Pa, at a temperature in K (ASHRAE 2017 ch. 1 eqs. 5–6, through psychrolib). NaN outside
 * the −100 to +200 °C the fits cover.
 */
export function saturationVapourPressure(temperature: number): number {
  useSi();
  try {
    return psychrolib.GetSatVapPres(temperature - 273.15);
  } catch {
    return Number.NaN;
  }
}

/**
 * Humidity ratio W, kg of water per kg of dry air, of air at a temperature (K), pressure (Pa) and
 * relative humidity (fraction 0–1): W = ε·p_w/(p − p_w) with p_w = RH·p_ws(T) (ASHRAE 2017 ch. 1
 * eqs. 12, 20 and 24), p_ws from psychrolib. The same as psychrolib's GetHumRatioFromRelHum, except
 * that it is exactly 0 for dry air and not held at psychrolib's floor of 1e-7 for very dry air.
 * NaN when the vapour pressure would reach the air's pressure: no such air exists (hot and thin
 * air at altitude cannot be that humid).
 */
export function humidityRatioFromRelativeHumidity(temperature: number, pressure: number, relativeHumidity: number): number {
  if (relativeHumidity === 0) return 0;
  if (!(relativeHumidity > 0 && relativeHumidity <= 1) || !(pressure > 0)) return Number.NaN;
  const vapourPressure = relativeHumidity * saturationVapourPressure(temperature);
  if (!(vapourPressure < pressure)) return Number.NaN;
  return (WATER_TO_AIR_MOLAR_MASS * vapourPressure) / (pressure - vapourPressure);
}

/** Gas constant, cp and γ of humid air of humidity ratio W (kg/kg): see the module note. Dry air at W = 0. */
export function humidAirGas(humidityRatio: number): ChargeGas {
  if (humidityRatio === 0) return DRY_AIR;
  const w = humidityRatio;
  const gasConstant = (AIR_GAS_CONSTANT * (1 + w / WATER_TO_AIR_MOLAR_MASS)) / (1 + w);
  const cp = (AIR_CP + w * WATER_VAPOUR_CP) / (1 + w);
  return { humidityRatio: w, gasConstant, cp, gamma: cp / (cp - gasConstant) };
}

/** Mass flow of dry air in a flow of humid air, kg/s: ṁ/(1 + W). */
export function dryAirMassFlow(humidAirMassFlow: number, humidityRatio: number): number {
  return humidityRatio === 0 ? humidAirMassFlow : humidAirMassFlow / (1 + humidityRatio);
}
