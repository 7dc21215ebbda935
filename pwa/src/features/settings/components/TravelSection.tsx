import { TextField } from '../../../components/TextField';
import { newBand, removeRow, updateRow } from '../model/businessForm';
import { CheckField, Problem, SettingsSection } from './FormBits';
import { AddButton, RemoveButton } from './PricesSection';
import { newRowKey, type SectionProps } from './sectionProps';

/** Travel fees by distance band, from near to far, and the drive-time factors. */
export function TravelSection({ draft, change, problems, currency }: SectionProps) {
  const bandsProblem = problems['settings.travel.bands'];
  return (
    <SettingsSection
      id="pp-settings-travel"
      title="Travel"
      lead="Each band covers the distance up to its kilometres; a visit further than the last band is quoted by hand."
    >
      {draft.bands.map((b, i) => {
        const what = `Band ${i + 1}`;
        return (
          <fieldset key={b.key} className="pp-settings__row">
            <legend className="pp-settings__row-title">{what}</legend>
            <div className="pp-settings__pair">
              <TextField
                label="Up to (km)"
                inputMode="decimal"
                autoComplete="off"
                value={b.upToKm}
                onChange={(e) =>
                  change({ bands: updateRow(draft.bands, b.key, { upToKm: e.target.value }) })
                }
                problem={problems[`settings.travel.bands.${i}.upToKm`]}
              />
              <TextField
                label={`Fee (${currency})`}
                inputMode="decimal"
                autoComplete="off"
                value={b.fee}
                onChange={(e) =>
                  change({ bands: updateRow(draft.bands, b.key, { fee: e.target.value }) })
                }
                problem={problems[`settings.travel.bands.${i}.feeMinor`]}
              />
            </div>
            <RemoveButton
              what={what}
              onRemove={() => change({ bands: removeRow(draft.bands, b.key) })}
            />
          </fieldset>
        );
      })}
      {bandsProblem ? <Problem>{bandsProblem}</Problem> : null}
      <AddButton
        words="Add a band"
        onAdd={() => change({ bands: [...draft.bands, newBand(newRowKey('band'))] })}
      />
      <CheckField
        label="The travel fee is taxed"
        checked={draft.travelTaxable}
        onChange={(travelTaxable) => change({ travelTaxable })}
      />

      <h3 className="pp-settings__subheading">Drive times</h3>
      <TextField
        label="Road factor"
        hint="Road distance ÷ straight-line distance between two addresses: about 1.3 in town."
        inputMode="decimal"
        autoComplete="off"
        value={draft.roadFactor}
        onChange={(e) => change({ roadFactor: e.target.value })}
        problem={problems['settings.drive.roadFactor']}
      />
      <TextField
        label="Average driving speed (km/h)"
        hint="Door to door, with junctions and parking."
        inputMode="decimal"
        autoComplete="off"
        value={draft.averageKmh}
        onChange={(e) => change({ averageKmh: e.target.value })}
        problem={problems['settings.drive.averageSpeedKmh']}
      />
    </SettingsSection>
  );
}
