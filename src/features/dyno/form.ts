import type { FieldErrors, FieldValues, Path, Resolver, UseFormSetError } from 'react-hook-form';
import type { z } from 'zod';
import type { BarometerUnit, DynoTemperatureUnit, WeatherFields } from '@shared/schemas/dyno';
import { numberToInput, parseNumber } from '@shared/numbers';
import { isApiError } from '@/lib/api-client';

/**
 * The dyno forms hold what a person types (text in boxes); the shared zod schema checks the
 * object sent to the server. These helpers turn one into the other and put each schema or
 * server message back next to the box it is about.
 */

export type WeatherFormValues = {
  temperature: string;
  temperatureUnit: DynoTemperatureUnit;
  pressure: string;
  pressureUnit: BarometerUnit;
  humidityKind: 'rh' | 'dew' | 'none';
  humidity: string;
};

export const emptyWeather: WeatherFormValues = {
  temperature: '',
  temperatureUnit: 'f',
  pressure: '',
  pressureUnit: 'inhg',
  humidityKind: 'rh',
  humidity: '',
};

export function weatherToForm(w: WeatherFields | null): WeatherFormValues {
  if (!w) return emptyWeather;
  return {
    temperature: String(w.temperature),
    temperatureUnit: w.temperatureUnit,
    pressure: String(w.pressure),
    pressureUnit: w.pressureUnit,
    humidityKind: w.relativeHumidityPct != null ? 'rh' : w.dewPoint != null ? 'dew' : 'none',
    humidity: numberToInput(w.relativeHumidityPct ?? w.dewPoint),
  };
}

/** The weather to send: none when temperature and pressure are both empty. */
export function weatherFromForm(v: WeatherFormValues): WeatherFields | null {
  if (v.temperature.trim() === '' && v.pressure.trim() === '') return null;
  const humidity = v.humidityKind === 'none' ? null : parseNumber(v.humidity);
  return {
    temperature: parseNumber(v.temperature) ?? Number.NaN,
    temperatureUnit: v.temperatureUnit,
    pressure: parseNumber(v.pressure) ?? Number.NaN,
    pressureUnit: v.pressureUnit,
    relativeHumidityPct: v.humidityKind === 'rh' ? humidity : null,
    dewPoint: v.humidityKind === 'dew' ? humidity : null,
  };
}

/** A schema or server path ("weather.dewPoint") → the form box it is about ("humidity"). */
export function weatherFieldOf(path: string): string {
  switch (path) {
    case 'weather.temperature':
    case 'weather.temperatureUnit':
      return 'temperature';
    case 'weather.pressure':
    case 'weather.pressureUnit':
      return 'pressure';
    case 'weather.relativeHumidityPct':
    case 'weather.dewPoint':
      return 'humidity';
    default:
      return path;
  }
}

/**
 * A react-hook-form resolver that builds the request from the boxes and checks it with the
 * shared schema; each issue goes to the box `fieldOf` names, the rest to the form.
 */
export function schemaResolver<V extends FieldValues, O>(
  schema: z.ZodType<O>,
  toInput: (values: V) => unknown,
  fieldOf: (path: string) => string = weatherFieldOf,
): Resolver<V, unknown, O> {
  return async (values) => {
    const parsed = schema.safeParse(toInput(values));
    if (parsed.success) return { values: parsed.data, errors: {} };
    const errors: Record<string, { type: string; message: string }> = {};
    for (const issue of parsed.error.issues) {
      const field = fieldOf(issue.path.join('.')) || 'root';
      const key = field in values ? field : 'root';
      errors[key] ??= { type: 'schema', message: issue.message };
    }
    return { values: {}, errors: errors as FieldErrors<V> };
  };
}

/** The server's refusal on the form: each field it names next to its box, the rest on top. */
export function applyFieldErrors<V extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<V>,
  values: V,
  fieldOf: (path: string) => string = weatherFieldOf,
) {
  if (!isApiError(error)) {
    setError('root.server', {
      type: 'server',
      message: 'Something unexpected happened. Try again.',
    });
    return;
  }
  let placed = 0;
  for (const [path, message] of Object.entries(error.fields ?? {})) {
    const field = fieldOf(path);
    if (field in values) {
      setError(field as Path<V>, { type: 'server', message }, { shouldFocus: placed === 0 });
      placed += 1;
    }
  }
  if (placed === 0) setError('root.server', { type: 'server', message: error.message });
}
