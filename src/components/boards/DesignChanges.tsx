import { describeChange, diffDesigns } from './design-diff.ts';

interface Props {
  before: unknown;
  after: unknown;
  beforeLabel: string;
  afterLabel: string;
}

/** A field-by-field table of what differs between two designs. */
export function DesignChanges({ before, after, beforeLabel, afterLabel }: Props) {
  const changes = diffDesigns(before, after);
  if (changes.length === 0) return <p className="text-sm text-ink-soft">No fields differ.</p>;
  return (
    <table className="w-full border-collapse text-left text-sm">
      <caption className="sr-only">Fields that differ</caption>
      <thead>
        <tr className="border-b border-paper-line">
          <th scope="col" className="px-2 py-1">Field</th>
          <th scope="col" className="px-2 py-1">{beforeLabel}</th>
          <th scope="col" className="px-2 py-1">{afterLabel}</th>
        </tr>
      </thead>
      <tbody>
        {changes.map((c) => {
          const words = describeChange(c, before, after);
          return (
            <tr key={c.path} className="border-b border-paper-line">
              <th scope="row" className="px-2 py-1 font-normal">{words.label}</th>
              <td className="px-2 py-1 font-mono">{words.before}</td>
              <td className="px-2 py-1 font-mono">{words.after}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
