import { InputError } from '../fileFormats/InputError.ts';

/** Air conditions for the speed of sound. */
export interface AirConditions {
  /** Air temperature, °C. */
  temperatureC: number;
  /** Relative humidity, % (default 0: dry air). */
  relativeHumidityPercent?: number;
  /** Barometric pressure, Pa (default 101 325); matters only through humidity. */
  pressurePa?: number;
}

/** Checks air conditions: −30…60 °C, 0…100 % RH, 50…110 kPa; throws InputError otherwise. */
export function checkAir(air: AirConditions, source = 'air'): void {
  const { temperatureC, relativeHumidityPercent = 0, pressurePa = 101_325 } = air;
  if (!Number.isFinite(temperatureC) || temperatureC < -30 || temperatureC > 60) throw new InputError(source, 'temperature', `${String(temperatureC)} °C is outside −30…60 °C`);
  if (!Number.isFinite(relativeHumidityPercent) || relativeHumidityPercent < 0 || relativeHumidityPercent > 100) {
    throw new InputError(source, 'humidity', `${String(relativeHumidityPercent)} % is outside 0…100 %`);
  }
  if (!Number.isFinite(pressurePa) || pressurePa < 50_000 || pressurePa > 110_000) throw new InputError(source, 'pressure', `${String(pressurePa)} Pa is outside 50–110 kPa`);
}

/**
 * Speed of sound in dry air, m/s, from the air temperature (°C): c = 331.3 √(1 + T/273.15)
 * (ideal gas, standard acoustics texts; 343.2 m/s at 20 °C).
 */
export function speedOfSoundDryAir(temperatureC: number): number {
  return 331.3 * Math.sqrt(1 + temperatureC / 273.15);
}

/**
 * Zero-frequency speed of sound in humid air, m/s, by Cramer's polynomial (J. Acoust. Soc. Am. 93
 * (1993) 2510, eq. 15; coefficients from memory) with the water-vapour mole fraction from the
 * saturation vapour pressure and enhancement factor of Davis (Metrologia 29 (1992) 67; from
 * memory), CO₂ mole fraction 0.0004.
 */
export function speedOfSoundCramer(temperatureC: number, relativeHumidityPercent: number, pressurePa = 101_325): number {
  const t = temperatureC;
  const kelvin = t + 273.15;
  const saturation = Math.exp(1.2811805e-5 * kelvin * kelvin - 1.9509874e-2 * kelvin + 34.04926034 - 6.3536311e3 / kelvin);
  const enhancement = 1.00062 + 3.14e-8 * pressurePa + 5.6e-7 * t * t;
  const water = ((relativeHumidityPercent / 100) * enhancement * saturation) / pressurePa;
  const carbonDioxide = 0.0004;
  const p = pressurePa;
  return (
    331.5024 +
    0.603055 * t -
    0.000528 * t * t +
    (51.471935 + 0.1495874 * t - 0.000782 * t * t) * water +
    (-1.82e-7 + 3.73e-8 * t - 2.93e-10 * t * t) * p +
    (-85.20931 - 0.228525 * t + 5.91e-5 * t * t) * carbonDioxide -
    2.835149 * water * water -
    2.15e-13 * p * p +
    29.179762 * carbonDioxide * carbonDioxide +
    0.000486 * water * p * carbonDioxide
  );
}

/**
 * Speed of sound, m/s, for resonator sizing: the dry-air formula (speedOfSoundDryAir), raised for
 * humidity by the ratio of Cramer's humid to dry values at the same temperature and pressure
 * (about +0.37 % at 20 °C, 100 % RH). Dry air gives exactly the dry-air formula.
 */
export function speedOfSound(air: AirConditions): number {
  checkAir(air);
  const dry = speedOfSoundDryAir(air.temperatureC);
  const humidity = air.relativeHumidityPercent ?? 0;
  if (humidity === 0) return dry;
  const pressure = air.pressurePa ?? 101_325;
  return (dry * speedOfSoundCramer(air.temperatureC, humidity, pressure)) / speedOfSoundCramer(air.temperatureC, 0, pressure);
}
