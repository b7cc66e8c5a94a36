/**
 * Errors the user can fix (bad input or usage): the CLI prints the message on one line and exits 2.
 * Messages follow `file:line:field: message` wherever a file is involved.
 */
export class InputError extends Error {
  override name = "InputError";
}

/** Builds the `file:line:field: message` form used by every input error. */
export function locate(
  file: string,
  line: number | undefined,
  field: string | undefined,
  message: string,
): string {
  const parts = [file];
  if (line !== undefined) parts.push(String(line));
  if (field !== undefined && field !== "") parts.push(field);
  return `${parts.join(":")}: ${message}`;
}

export function inputError(
  file: string,
  line: number | undefined,
  field: string | undefined,
  message: string,
): InputError {
  return new InputError(locate(file, line, field, message));
}
