import { useState } from 'react';
import { Notice } from '../../../components/Notice';
import { useOwnUnits } from '../hooks/useOwnUnits';
import { useUnits } from '../useUnits';
import { ChoiceGroup, SettingsSection } from './FormBits';
import '../settings.css';

/**
 * What a helper may set: the units they read thickness and temperature in, on this phone.
 * Prices, tax and the team are the owner's. Works offline: nothing goes to the server.
 */
export function HelperUnitsScreen() {
  const units = useUnits();
  const { choose } = useOwnUnits();
  const [result, setResult] = useState<'kept' | 'refused' | null>(null);

  function pick(change: { thickness?: 'um' | 'mil'; temperature?: 'C' | 'F' }) {
    const kept = choose({
      thickness: change.thickness ?? units.thickness,
      temperature: change.temperature ?? units.temperature,
    });
    setResult(kept ? 'kept' : 'refused');
  }

  return (
    <div className="pp-settings">
      <SettingsSection
        id="pp-settings-own-units"
        title="Your units"
        lead="How this phone shows paint thickness and temperatures to you. Readings are kept the same whatever you choose; the business's prices and settings are the owner's."
      >
        <ChoiceGroup
          legend="Paint thickness in"
          name="own-thickness"
          value={units.thickness}
          choices={[
            { value: 'um', words: 'micrometres (µm)' },
            { value: 'mil', words: 'mils (thousandths of an inch)' },
          ]}
          onChange={(thickness) => pick({ thickness })}
        />
        <ChoiceGroup
          legend="Temperatures in"
          name="own-temperature"
          value={units.temperature}
          choices={[
            { value: 'C', words: 'degrees Celsius (°C)' },
            { value: 'F', words: 'degrees Fahrenheit (°F)' },
          ]}
          onChange={(temperature) => pick({ temperature })}
        />
        {result === 'kept' ? (
          <Notice tone="done">
            Kept on this phone: thickness in {units.thicknessSymbol}, temperatures in{' '}
            {units.temperatureSymbol}.
          </Notice>
        ) : null}
        {result === 'refused' ? (
          <Notice tone="stop">
            This phone would not keep the choice (its storage is full or blocked), so the units stay
            as they were.
          </Notice>
        ) : null}
      </SettingsSection>
    </div>
  );
}
