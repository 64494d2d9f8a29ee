/**
 * The parameter form. Every field shows its units in its label, its help below and its errors
 * right below that; the errors come from the shared design schema (see design-draft.ts). The
 * plain fields are rows of the field table (design-fields.ts), shown group by group; name, units,
 * temperament and markers have controls of their own.
 */
import { useId, useState, type ChangeEvent, type ReactNode } from 'react';
import type { DesignIssue } from '~/lib/schemas/design.ts';
import { formatLength } from '~/lib/format/units.ts';
import { DESIGN_FIELDS, type DesignFieldRow, type FieldGroup } from '~/lib/schemas/design-fields.ts';
import { BUTTON, FIELD_ERROR, INPUT } from './control-styles.ts';
import {
  applySpacingOffer,
  fieldOfIssue,
  parseNumber,
  spacingOffer,
  switchUnits,
  typedLength,
  type ChoiceField,
  type DesignDraft,
  type FlagField,
  type LengthField,
  type NumberField,
} from './design-draft.ts';
import { RadiusPicks } from './RadiusPicks.tsx';
import { ScaleConventionFigure } from './ScaleConventionFigure.tsx';
import { ScalaUpload } from './ScalaUpload.tsx';

export interface PresetChoice {
  id: string;
  label: string;
}

interface DesignFormProps {
  draft: DesignDraft;
  onChange: (update: (draft: DesignDraft) => DesignDraft) => void;
  issues: readonly DesignIssue[];
  presets: readonly PresetChoice[];
  onStartFrom: (presetId: string) => void;
}

export function DesignForm({ draft, onChange, issues, presets, onStartFrom }: DesignFormProps) {
  const units = draft.units;
  const [presetId, setPresetId] = useState(presets[0]?.id ?? '');
  const presetSelectId = useId();
  const errorsOf = (field: string) => issues.filter((issue) => fieldOfIssue(issue.path) === field).map((issue) => issue.message);
  const general = issues.filter((issue) => issue.path === 'design');
  // The string count before the user started changing it: the spacing offer compares with it.
  const [stringsBefore, setStringsBefore] = useState<number | null>(null);
  const [spacingNote, setSpacingNote] = useState('');
  const offer = stringsBefore === null ? null : spacingOffer(draft, stringsBefore);
  const show = (value: number) => formatLength(value, units, true);

  const count = (field: NumberField, label: string, inputMode: 'numeric' | 'decimal' = 'numeric', help?: string) => (
    <TextField
      key={field}
      path={field}
      label={label}
      help={help}
      value={draft.numbers[field]}
      errors={errorsOf(field)}
      inputMode={inputMode}
      onChange={(text) => {
        if (field === 'strings') {
          const before = parseNumber(draft.numbers.strings);
          if (stringsBefore === null && before !== null && Number.isInteger(before)) setStringsBefore(before);
          setSpacingNote('');
        }
        onChange((d) => ({ ...d, numbers: { ...d.numbers, [field]: text } }));
      }}
    />
  );
  const spacing = offer && (
    <div role="group" aria-label="String spacing for the new string count" className="space-y-1 rounded border border-caution bg-caution-light p-2 text-xs">
      <p>
        {offer.from} → {offer.to} strings. Keep {show(offer.perStringNut)} between strings at the nut and {show(offer.perStringBridge)} at the bridge
        ({show(offer.nut)} and {show(offer.bridge)} between the outer strings), or keep the outer spacing
        ({show(offer.perStringNut * (offer.from - 1))} and {show(offer.perStringBridge * (offer.from - 1))})?
      </p>
      <div className="flex gap-2">
        <button type="button" className={BUTTON} onClick={() => {
          onChange((d) => applySpacingOffer(d, offer));
          setSpacingNote(`Spacing scaled for ${offer.to} strings: ${show(offer.nut)} at the nut and ${show(offer.bridge)} at the bridge (${show(offer.perStringNut)} and ${show(offer.perStringBridge)} per string, as before).`);
          setStringsBefore(null);
        }}>Keep the spacing per string</button>
        <button type="button" className={BUTTON} onClick={() => {
          setSpacingNote(`Outer spacing kept for ${offer.to} strings: the strings are closer together than before.`);
          setStringsBefore(null);
        }}>Keep the outer spacing</button>
      </div>
    </div>
  );
  const row = (field: DesignFieldRow) => {
    if ('shownWhen' in field && !draft.flags[field.shownWhen]) return null;
    switch (field.kind) {
      case 'length': {
        const path: LengthField = field.path;
        const input = (
          <TextField
            key={path}
            path={path}
            label={`${field.label} (${units})`}
            help={field.help}
            value={draft.lengths[path].text}
            errors={errorsOf(path)}
            inputMode="decimal"
            onChange={(text) => {
              // Typing a spacing answers the spacing offer.
              if (path.startsWith('stringSpacing.')) setStringsBefore(null);
              onChange((d) => ({ ...d, lengths: { ...d.lengths, [path]: typedLength(text) } }));
            }}
          />
        );
        // The quick picks sit under the last radius field.
        if (path !== 'radius.end') return input;
        return (
          <div key={path} className="space-y-2">
            {input}
            <RadiusPicks units={units} onPick={(pick, text) => onChange((d) => ({ ...d, lengths: { ...d.lengths, [pick]: typedLength(text) } }))} />
          </div>
        );
      }
      case 'flag': {
        const path: FlagField = field.path;
        return (
          <Checkbox key={path} label={field.label} checked={draft.flags[path]} onChange={(on) => onChange((d) => ({ ...d, flags: { ...d.flags, [path]: on } }))} />
        );
      }
      case 'choice': {
        const path: ChoiceField = field.path;
        return (
          <fieldset key={path} aria-describedby={`help-${path}`}>
            <legend className="text-sm">{field.label}</legend>
            <div className="flex flex-col gap-1 text-sm">
              {field.options.map((option) => (
                <label key={option} className="flex items-center gap-1">
                  <input
                    type="radio"
                    name={path}
                    value={option}
                    checked={draft.choices[path] === option}
                    onChange={() => onChange((d) => ({ ...d, choices: { ...d.choices, [path]: option } }))}
                  />
                  {(field.optionLabels as Readonly<Record<string, string>>)[option]}
                </label>
              ))}
            </div>
            {path === 'scaleAlong' && (
              <>
                <ScaleConventionFigure />
                <a href="/measuring" className="text-xs">How Kerfline measures</a>
              </>
            )}
            <p id={`help-${path}`} className="text-xs text-ink-soft">{field.help}</p>
            {errorsOf(path).length > 0 && <p id={`error-${path}`} className={FIELD_ERROR}>{errorsOf(path).join('; ')}</p>}
          </fieldset>
        );
      }
      case 'whole':
      case 'real':
        return count(field.path, field.label, field.kind === 'real' ? 'decimal' : 'numeric', field.help);
    }
  };
  const rowsOf = (group: FieldGroup) => DESIGN_FIELDS.filter((field) => field.group === group).map(row);

  return (
    <form className="space-y-3" aria-label="Design parameters" onSubmit={(event) => event.preventDefault()} noValidate>
      <Group title="Start from">
        <label htmlFor={presetSelectId} className="block text-sm">Preset</label>
        <div className="flex gap-2">
          <select id={presetSelectId} className={INPUT} value={presetId} onChange={(event) => setPresetId(event.target.value)}>
            {presets.map((preset) => (
              <option key={preset.id} value={preset.id}>{preset.label}</option>
            ))}
          </select>
          <button type="button" className={BUTTON} onClick={() => onStartFrom(presetId)}>Start</button>
        </div>
        <p className="text-xs text-ink-soft">Replaces every field below with the preset's values.</p>
      </Group>

      {general.length > 0 && (
        <ul className={FIELD_ERROR} role="alert">
          {general.map((issue) => <li key={issue.message}>{issue.message}</li>)}
        </ul>
      )}

      <Group title="Design">
        <TextField path="name" label="Design name" value={draft.name} errors={errorsOf('name')} onChange={(name) => onChange((d) => ({ ...d, name }))} />
        <fieldset>
          <legend className="text-sm">Units</legend>
          <div className="flex gap-4 text-sm">
            {(['mm', 'in'] as const).map((choice) => (
              <label key={choice} className="flex items-center gap-1">
                <input
                  type="radio"
                  name="units"
                  value={choice}
                  checked={units === choice}
                  onChange={() => onChange((d) => switchUnits(d, choice))}
                />
                {choice === 'mm' ? 'Millimetres (mm)' : 'Inches (in)'}
              </label>
            ))}
          </div>
          <p className="text-xs text-ink-soft">Switching converts every length exactly (1 in = 25.4 mm).</p>
        </fieldset>
      </Group>

      <Group title="Strings and scale">
        {rowsOf('Strings and scale')}
        {spacing}
        {spacingNote && <p role="status" className="text-xs text-ink-soft">{spacingNote}</p>}
      </Group>

      <Group title="Board">{rowsOf('Board')}</Group>

      <Group title="Temperament">
        <div className="flex flex-col gap-1 text-sm">
          <label className="flex items-center gap-1">
            <input type="radio" name="temperament" checked={draft.temperamentKind === 'equal'} onChange={() => onChange((d) => ({ ...d, temperamentKind: 'equal' }))} />
            Equal divisions of the octave
          </label>
          <label className="flex items-center gap-1">
            <input type="radio" name="temperament" checked={draft.temperamentKind === 'scala'} onChange={() => onChange((d) => ({ ...d, temperamentKind: 'scala' }))} />
            Scala scale file (.scl)
          </label>
        </div>
        {draft.temperamentKind === 'equal' ? (
          count('temperament.divisions', 'Divisions per octave')
        ) : (
          <ScalaUpload
            scl={draft.scl}
            errors={errorsOf('temperament.scl')}
            onLoaded={(scl) => onChange((d) => ({ ...d, scl, temperamentKind: 'scala' }))}
          />
        )}
      </Group>

      <Group title="Slots">{rowsOf('Slots')}</Group>

      <Group title="Fret wire">{rowsOf('Fret wire')}</Group>

      <Group title="Compensation">{rowsOf('Compensation')}</Group>

      <Group title="Markers">
        <TextField path="markers.single" label="Single markers at frets" value={draft.singleMarkers} errors={[]} onChange={(singleMarkers) => onChange((d) => ({ ...d, singleMarkers }))} />
        <TextField path="markers.double" label="Double markers at frets" value={draft.doubleMarkers} errors={[]} onChange={(doubleMarkers) => onChange((d) => ({ ...d, doubleMarkers }))} />
        <p className="text-xs text-ink-soft">Fret numbers separated by spaces or commas.</p>
        {errorsOf('markers').length > 0 && (
          <p id="error-markers" className={FIELD_ERROR}>
            Markers: {errorsOf('markers').join('; ')}
          </p>
        )}
      </Group>
    </form>
  );
}

function Group({ title, children }: { title: string; children: ReactNode }) {
  return (
    <fieldset className="space-y-2 rounded border border-paper-line bg-white p-3">
      <legend className="px-1 text-sm font-semibold">{title}</legend>
      {children}
    </fieldset>
  );
}

interface TextFieldProps {
  path: string;
  label: string;
  help?: string | undefined;
  value: string;
  errors: readonly string[];
  inputMode?: 'numeric' | 'decimal';
  onChange: (text: string) => void;
}

function TextField({ path, label, help, value, errors, inputMode, onChange }: TextFieldProps) {
  const id = `field-${path}`;
  const errorId = `error-${path}`;
  const helpId = `help-${path}`;
  const invalid = errors.length > 0;
  const describedBy = [help ? helpId : '', invalid ? errorId : ''].filter(Boolean).join(' ');
  return (
    <div>
      <label htmlFor={id} className="block text-sm">{label}</label>
      <input
        id={id}
        name={path}
        type="text"
        inputMode={inputMode}
        autoComplete="off"
        spellCheck={false}
        className={INPUT}
        value={value}
        aria-invalid={invalid}
        aria-describedby={describedBy || undefined}
        onChange={(event: ChangeEvent<HTMLInputElement>) => onChange(event.target.value)}
      />
      {help && <p id={helpId} className="text-xs text-ink-soft">{help}</p>}
      {invalid && (
        <p id={errorId} className={FIELD_ERROR}>
          {errors.join('; ')}
        </p>
      )}
    </div>
  );
}

function Checkbox({ label, checked, onChange }: { label: string; checked: boolean; onChange: (checked: boolean) => void }) {
  return (
    <label className="flex items-center gap-2 text-sm">
      <input type="checkbox" checked={checked} onChange={(event) => onChange(event.target.checked)} />
      {label}
    </label>
  );
}
