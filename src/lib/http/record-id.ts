/**
 * The one parser for ids in URLs (route parameters such as `/api/boards/{id}`, `?board=`,
 * `?revision=`): a positive whole number written plainly, at most 16 digits and safe as a double.
 * "7e0", "07", " 7", "0x7" and "7.0" are not ids, so every route answers them the same way: as an
 * unknown id (404), or a 400 naming the query parameter.
 */
export function parseRecordId(raw: string | null | undefined): number | null {
  if (!raw || !/^[1-9][0-9]{0,15}$/.test(raw)) return null;
  const id = Number(raw);
  return Number.isSafeInteger(id) ? id : null;
}
