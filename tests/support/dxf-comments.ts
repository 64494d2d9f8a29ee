/** The text of every comment (group code 999) in a DXF file, in order (DXF reference: group codes). */
export function dxfComments(text: string): string[] {
  const lines = text.split(/\r?\n/);
  const comments: string[] = [];
  for (let i = 0; i + 1 < lines.length; i += 2) {
    if (lines[i]!.trim() === '999') comments.push(lines[i + 1]!);
  }
  return comments;
}
