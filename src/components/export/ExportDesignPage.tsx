/**
 * Stand-alone page around the Export panel: pick a demo preset, paste a design as JSON or load a
 * design file, then export it. The editor mounts ExportPanel directly.
 */
import { useState } from 'react';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { validateDesign, type Design, type DesignIssue } from '~/lib/schemas/design.ts';
import ExportPanel from './ExportPanel.tsx';

const FIRST = DEMO_DESIGNS[0]!;

export default function ExportDesignPage() {
  const [presetId, setPresetId] = useState(FIRST.id);
  const [text, setText] = useState(() => JSON.stringify(FIRST.design, null, 2));
  const [design, setDesign] = useState<Design>(FIRST.design);
  const [issues, setIssues] = useState<DesignIssue[]>([]);

  function applyText(value: string) {
    setText(value);
    let parsed: unknown;
    try {
      parsed = JSON.parse(value);
    } catch (error) {
      setIssues([{ path: 'design', message: `not valid JSON (${error instanceof Error ? error.message : 'parse error'})` }]);
      return;
    }
    const result = validateDesign(parsed);
    if (result.ok) {
      setDesign(result.design);
      setIssues([]);
    } else {
      setIssues(result.issues);
    }
  }

  function choosePreset(id: string) {
    const preset = DEMO_DESIGNS.find((d) => d.id === id);
    if (!preset) return;
    setPresetId(id);
    applyText(JSON.stringify(preset.design, null, 2));
  }

  async function loadFile(file: File | undefined) {
    if (file) applyText(await file.text());
  }

  return (
    <div className="space-y-6">
      <section className="grid gap-3 rounded border border-paper-line bg-white p-4 md:grid-cols-2">
        <div className="space-y-3">
          <div className="flex flex-col gap-1 text-sm">
            <label htmlFor="design-preset">Demo preset</label>
            <select id="design-preset" className="rounded border border-paper-line px-2 py-1" value={presetId} onChange={(e) => choosePreset(e.target.value)}>
              {DEMO_DESIGNS.map((d) => (
                <option key={d.id} value={d.id}>
                  {d.design.name}
                </option>
              ))}
            </select>
          </div>
          <div className="flex flex-col gap-1 text-sm">
            <label htmlFor="design-file">Design file (.json)</label>
            <input id="design-file" type="file" accept="application/json,.json" onChange={(e) => void loadFile(e.target.files?.[0])} />
          </div>
          <p className="text-sm text-ink-soft">
            Exporting: <span className="font-medium text-ink">{design.name}</span> ({design.strings} strings,{' '}
            {design.frets} frets, {design.units})
          </p>
        </div>
        <div className="flex flex-col gap-1 text-sm">
          <label htmlFor="design-json">Design as JSON</label>
          <textarea
            id="design-json"
            className="h-48 rounded border border-paper-line p-2 font-mono text-xs"
            value={text}
            spellCheck={false}
            onChange={(e) => applyText(e.target.value)}
            aria-invalid={issues.length > 0}
            aria-describedby={issues.length > 0 ? 'design-issues' : undefined}
          />
          {issues.length > 0 && (
            <ul id="design-issues" className="text-xs text-rosewood">
              {issues.map((issue) => (
                <li key={`${issue.path}:${issue.message}`}>
                  {issue.path}: {issue.message}
                </li>
              ))}
            </ul>
          )}
        </div>
      </section>
      {issues.length > 0 && <p className="text-sm text-rosewood">Exports below use the last valid design until the JSON is fixed.</p>}
      <ExportPanel design={design} />
    </div>
  );
}
