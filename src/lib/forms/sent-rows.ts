import type { FieldValues, UseFormSetError } from 'react-hook-form';

/**
 * A setError for a line table whose blank rows are dropped before sending: the server's
 * `<field>.N…` names the Nth row sent, which is form row `sent[N]` (`sent` lists the kept rows'
 * indexes in order). Other paths pass through unchanged.
 */
export function setErrorOnSentRows<T extends FieldValues>(setError: UseFormSetError<T>, field: string, sent: readonly number[]): UseFormSetError<T> {
  const row = new RegExp(`^${field}\\.(\\d+)`);
  return (name, error, options) => setError(name.replace(row, (_, n: string) => `${field}.${sent[Number(n)] ?? n}`) as typeof name, error, options);
}
