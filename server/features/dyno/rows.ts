/** Row ↔ object helpers shared by the dyno repositories: weather columns and people. */
import type { WeatherFields } from '@shared/schemas/dyno';

export type WeatherRow = {
  weather_temperature: number | null;
  weather_temperature_unit: WeatherFields['temperatureUnit'] | null;
  weather_pressure: number | null;
  weather_pressure_unit: WeatherFields['pressureUnit'] | null;
  weather_relative_humidity_pct: number | null;
  weather_dew_point: number | null;
};

export function weatherFromRow(r: WeatherRow): WeatherFields | null {
  if (
    r.weather_temperature == null ||
    r.weather_temperature_unit == null ||
    r.weather_pressure == null ||
    r.weather_pressure_unit == null
  ) {
    return null;
  }
  return {
    temperature: r.weather_temperature,
    temperatureUnit: r.weather_temperature_unit,
    pressure: r.weather_pressure,
    pressureUnit: r.weather_pressure_unit,
    relativeHumidityPct: r.weather_relative_humidity_pct,
    dewPoint: r.weather_dew_point,
  };
}

/** A weather record as columns; null clears them all. */
export function weatherToRow(w: WeatherFields | null): WeatherRow {
  return {
    weather_temperature: w?.temperature ?? null,
    weather_temperature_unit: w?.temperatureUnit ?? null,
    weather_pressure: w?.pressure ?? null,
    weather_pressure_unit: w?.pressureUnit ?? null,
    weather_relative_humidity_pct: w?.relativeHumidityPct ?? null,
    weather_dew_point: w?.dewPoint ?? null,
  };
}

export function person(id: string | null, name: string | null) {
  return id ? { id, name: name ?? '' } : null;
}
