import { TextField } from '../../../components/TextField';
import { ChoiceGroup, SettingsSection } from './FormBits';
import type { SectionProps } from './sectionProps';

/** Default waits, what an hour of labour costs, and the units the field screens show. */
export function WaitsSection({ draft, change, problems, currency }: SectionProps) {
  return (
    <>
      <SettingsSection id="pp-settings-waits" title="Waits">
        <TextField
          label="Keep dry after protection (hours)"
          hint="The keep-dry window a new protection starts with; each product may differ."
          inputMode="decimal"
          autoComplete="off"
          value={draft.keepDryHours}
          onChange={(e) => change({ keepDryHours: e.target.value })}
          problem={problems['settings.waits.keepDryHours']}
        />
        <TextField
          label="Maintenance reminder after (months)"
          hint="When the customer is reminded of a maintenance visit after protection."
          inputMode="numeric"
          autoComplete="off"
          value={draft.reminderMonths}
          onChange={(e) => change({ reminderMonths: e.target.value })}
          problem={problems['settings.waits.maintenanceReminderMonths']}
        />
      </SettingsSection>

      <SettingsSection id="pp-settings-labour" title="Labour cost">
        <TextField
          label={`What an hour of work costs you (${currency})`}
          hint="Wages and your own time: profit per job subtracts it for the hours timed."
          inputMode="decimal"
          autoComplete="off"
          value={draft.labourCost}
          onChange={(e) => change({ labourCost: e.target.value })}
          problem={problems['settings.labourCostPerHourMinor']}
        />
      </SettingsSection>

      <SettingsSection id="pp-settings-units" title="Units">
        <ChoiceGroup
          legend="Paint thickness in"
          name="business-thickness"
          value={draft.thickness}
          choices={[
            { value: 'um', words: 'micrometres (µm)' },
            { value: 'mil', words: 'mils (thousandths of an inch)' },
          ]}
          onChange={(thickness) => change({ thickness })}
        />
        <ChoiceGroup
          legend="Temperatures in"
          name="business-temperature"
          value={draft.temperature}
          choices={[
            { value: 'C', words: 'degrees Celsius (°C)' },
            { value: 'F', words: 'degrees Fahrenheit (°F)' },
          ]}
          onChange={(temperature) => change({ temperature })}
        />
      </SettingsSection>
    </>
  );
}
