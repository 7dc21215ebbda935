import { TextField } from '../../../components/TextField';
import { Notice } from '../../../components/Notice';
import { useHereLocation } from '../hooks/useHereLocation';
import { SettingsSection } from './FormBits';
import type { SectionProps } from './sectionProps';

function currencyName(code: string): string {
  try {
    return new Intl.DisplayNames(['en'], { type: 'currency' }).of(code) ?? code;
  } catch {
    return code;
  }
}

/** The business as customers see it, and the base its day's driving starts from. */
export function BusinessSection({ draft, change, problems, currency }: SectionProps) {
  const { here, locate } = useHereLocation();

  function fillFromHere() {
    locate((at) => change({ baseLat: String(at.lat), baseLng: String(at.lng) }));
  }

  return (
    <SettingsSection id="pp-settings-business" title="Business">
      <TextField
        label="Business name"
        autoComplete="organization"
        value={draft.name}
        onChange={(e) => change({ name: e.target.value })}
        problem={problems.name}
      />
      <TextField
        label="Contact e-mail"
        hint="Shown to customers on quotes and receipts. Optional."
        type="email"
        inputMode="email"
        autoComplete="email"
        value={draft.email}
        onChange={(e) => change({ email: e.target.value })}
        problem={problems['settings.profile.email']}
      />
      <TextField
        label="Contact phone"
        type="tel"
        inputMode="tel"
        autoComplete="tel"
        value={draft.phone}
        onChange={(e) => change({ phone: e.target.value })}
        problem={problems['settings.profile.phone']}
      />
      <TextField
        label="Address"
        autoComplete="street-address"
        value={draft.address}
        onChange={(e) => change({ address: e.target.value })}
        problem={problems['settings.profile.address']}
      />
      <TextField
        label="Time zone"
        hint="Where you work, for today's visits and reminders, e.g. America/Chicago."
        autoComplete="off"
        autoCapitalize="off"
        value={draft.timezone}
        onChange={(e) => change({ timezone: e.target.value })}
        problem={problems.timezone}
      />
      <p className="pp-settings__fact">
        <span className="pp-field__label">Currency</span>{' '}
        <span>
          {currency} ({currencyName(currency)}). Every amount in Settings is typed in {currency}.
        </span>
      </p>

      <fieldset className="pp-settings__group">
        <legend className="pp-settings__subheading">Base for drive times</legend>
        <p className="pp-settings__note">
          Where your day starts, as a map position: the drive to the first visit is estimated from
          it.
        </p>
        <div className="pp-settings__pair">
          <TextField
            label="Latitude"
            hint="e.g. 44.6301"
            autoComplete="off"
            value={draft.baseLat}
            onChange={(e) => change({ baseLat: e.target.value })}
            problem={problems['settings.profile.base.lat']}
          />
          <TextField
            label="Longitude"
            hint="West is below zero, e.g. -63.5712"
            autoComplete="off"
            value={draft.baseLng}
            onChange={(e) => change({ baseLng: e.target.value })}
            problem={problems['settings.profile.base.lng']}
          />
        </div>
        <button
          type="button"
          className="pp-button pp-settings__quiet"
          onClick={fillFromHere}
          disabled={here.state === 'finding'}
        >
          {here.state === 'finding' ? 'Finding this phone…' : "Use this phone's location"}
        </button>
        {here.state === 'found' ? (
          <Notice tone="done">
            Base set to this phone&apos;s position ({here.lat}, {here.lng}), within about{' '}
            {here.accuracyM} m. Save to keep it.
          </Notice>
        ) : null}
        {here.state === 'failed' ? <Notice tone="wait">{here.problem}</Notice> : null}
      </fieldset>
    </SettingsSection>
  );
}
