import type { FieldErrors, Path, UseFormRegister } from 'react-hook-form';
import {
  barometerUnitLabels,
  barometerUnits,
  dynoTemperatureUnitLabels,
  dynoTemperatureUnits,
} from '@shared/schemas/dyno';
import { FormField, SelectInput } from '@/components/ui/form-field';
import { NumberInput } from '@/components/ui/number-input';
import type { WeatherFormValues } from '../form';

/**
 * The weather boxes of a session or a run: dry-bulb temperature, station pressure (as read
 * at the dyno, not corrected to sea level) and the humidity as relative humidity or a dew point.
 */
export function WeatherFields<V extends WeatherFormValues>({
  register,
  errors,
  humidityKind,
}: {
  register: UseFormRegister<V>;
  errors: FieldErrors<V>;
  humidityKind: WeatherFormValues['humidityKind'];
}) {
  const reg = (name: keyof WeatherFormValues) => register(name as Path<V>);
  const err = (name: keyof WeatherFormValues) =>
    (errors as FieldErrors<WeatherFormValues>)[name]?.message;
  return (
    <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
      <div className="grid grid-cols-[1fr_6rem] items-start gap-2">
        <FormField label="Air temperature (dry bulb)" error={err('temperature')}>
          {(c) => <NumberInput {...c} {...reg('temperature')} />}
        </FormField>
        <FormField label="Temperature unit">
          {(c) => (
            <SelectInput {...c} {...reg('temperatureUnit')}>
              {dynoTemperatureUnits.map((u) => (
                <option key={u} value={u}>
                  {dynoTemperatureUnitLabels[u]}
                </option>
              ))}
            </SelectInput>
          )}
        </FormField>
      </div>
      <div className="grid grid-cols-[1fr_8rem] items-start gap-2">
        <FormField
          label="Station pressure"
          hint="As read at the dyno, not the sea-level figure a forecast gives"
          error={err('pressure')}
        >
          {(c) => <NumberInput {...c} {...reg('pressure')} />}
        </FormField>
        <FormField label="Pressure unit">
          {(c) => (
            <SelectInput {...c} {...reg('pressureUnit')}>
              {barometerUnits.map((u) => (
                <option key={u} value={u}>
                  {barometerUnitLabels[u]}
                </option>
              ))}
            </SelectInput>
          )}
        </FormField>
      </div>
      <FormField label="Humidity given as">
        {(c) => (
          <SelectInput {...c} {...reg('humidityKind')}>
            <option value="rh">Relative humidity, %</option>
            <option value="dew">Dew point, in the temperature unit</option>
            <option value="none">Not recorded (taken as dry air)</option>
          </SelectInput>
        )}
      </FormField>
      {humidityKind !== 'none' && (
        <FormField
          label={humidityKind === 'rh' ? 'Relative humidity, %' : 'Dew point'}
          optional
          error={err('humidity')}
        >
          {(c) => <NumberInput {...c} {...reg('humidity')} />}
        </FormField>
      )}
    </div>
  );
}
