/** The id MariaDB gave the one row just inserted (`$returningId()` answers one entry per row). */
export function insertedId(rows: readonly { id: number }[]): number {
  const [row] = rows;
  if (!row) throw new Error('the insert answered no id');
  return row.id;
}
