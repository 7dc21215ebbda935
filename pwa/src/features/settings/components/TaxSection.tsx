import { formatMinor } from '@panelpass/shared';
import { TextField } from '../../../components/TextField';
import type { DepositKind, Rounding, TaxBasis } from '../api/businessApi';
import { ROUNDING_WORDS, roundingExample } from '../model/roundingExample';
import { parsePercentBp } from '../model/typedNumbers';
import { ChoiceGroup, SettingsSection } from './FormBits';
import type { SectionProps } from './sectionProps';

const BASES: { value: TaxBasis; words: string; line: string }[] = [
  {
    value: 'per-invoice',
    words: 'On the taxable total',
    line: 'The taxed lines are added up and the tax worked out once.',
  },
  {
    value: 'per-line',
    words: 'On each taxable line',
    line: 'Each taxed line gets its own tax, rounded, and the taxes are added.',
  },
];

const MODES: { value: Rounding; words: string; line: string }[] = (
  ['half-up', 'half-even'] as const
).map((mode) => ({
  value: mode,
  words: ROUNDING_WORDS[mode].title,
  line: ROUNDING_WORDS[mode].line,
}));

/** The tax rate, what it is charged on, how it is rounded (with a worked example), and the deposit. */
export function TaxSection({ draft, change, problems, currency }: SectionProps) {
  return (
    <>
      <SettingsSection id="pp-settings-tax" title="Tax and rounding">
        <TextField
          label="Tax rate (%)"
          hint="Like 8.25; 0 when you charge no tax."
          inputMode="decimal"
          autoComplete="off"
          value={draft.taxRate}
          onChange={(e) => change({ taxRate: e.target.value })}
          problem={problems['settings.tax.rateBp']}
        />
        <ChoiceGroup
          legend="Tax is worked out"
          name="tax-basis"
          value={draft.taxBasis}
          choices={BASES}
          onChange={(taxBasis) => change({ taxBasis })}
        />
        <ChoiceGroup
          legend="Rounding to the cent"
          name="tax-rounding"
          value={draft.taxRounding}
          choices={MODES}
          onChange={(taxRounding) => change({ taxRounding })}
        />
        <WorkedExample rateText={draft.taxRate} mode={draft.taxRounding} currency={currency} />
      </SettingsSection>

      <SettingsSection id="pp-settings-deposit" title="Deposit">
        <ChoiceGroup<DepositKind>
          legend="At booking, ask for"
          name="deposit-kind"
          value={draft.depositKind}
          choices={[
            { value: 'percent', words: 'A share of the total' },
            { value: 'fixed', words: 'A fixed amount' },
            { value: 'none', words: 'No deposit' },
          ]}
          onChange={(depositKind) => change({ depositKind })}
        />
        {draft.depositKind === 'percent' ? (
          <>
            <TextField
              label="Share of the total (%)"
              inputMode="decimal"
              autoComplete="off"
              value={draft.depositPercent}
              onChange={(e) => change({ depositPercent: e.target.value })}
              problem={problems['settings.deposit.percentBp']}
            />
            <TextField
              label={`Round the deposit to (${currency})`}
              hint="Like 1.00 for whole amounts; empty keeps every cent."
              inputMode="decimal"
              autoComplete="off"
              value={draft.depositRoundTo}
              onChange={(e) => change({ depositRoundTo: e.target.value })}
              problem={problems['settings.deposit.roundToMinor']}
            />
          </>
        ) : null}
        {draft.depositKind === 'fixed' ? (
          <TextField
            label={`Deposit (${currency})`}
            inputMode="decimal"
            autoComplete="off"
            value={draft.depositAmount}
            onChange={(e) => change({ depositAmount: e.target.value })}
            problem={problems['settings.deposit.amountMinor']}
          />
        ) : null}
      </SettingsSection>
    </>
  );
}

/** The rounding modes on one amount at the rate being typed, worked out by shared's rounding. */
function WorkedExample({
  rateText,
  mode,
  currency,
}: {
  rateText: string;
  mode: Rounding;
  currency: string;
}) {
  const rate = parsePercentBp(rateText);
  if (!rate.ok) return null;
  const ex = roundingExample(rate.value, currency);
  const money = (m: number) => formatMinor(m, currency);
  const chosen = mode === 'half-up' ? ex.halfUpMinor : ex.halfEvenMinor;
  const percent = rateText.replace(/\s*%$/, '').trim();
  return (
    <div className="pp-settings__example" aria-live="polite">
      <p className="pp-field__label">Worked example</p>
      <p>
        Tax on {money(ex.amountMinor)} at {percent} % is exactly {ex.exactTax} {currency}.
      </p>
      {ex.kind === 'never-half' ? (
        <p>
          At {percent} % the tax never lands exactly on half a cent, so both ways give the same:{' '}
          <strong>{money(chosen)}</strong>.
        </p>
      ) : (
        <p>
          Half up gives {money(ex.halfUpMinor)}; half to even gives {money(ex.halfEvenMinor)}. You
          charge <strong>{money(chosen)}</strong>.
        </p>
      )}
    </div>
  );
}
