import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';

/**
 * Puts the server's validation issues on the form fields they name; returns the messages whose
 * path is not one of `knownPaths` (show those next to the form's general message).
 */
export function applyServerIssues<T extends FieldValues>(
  issues: { path: string; message: string }[] | undefined,
  setError: UseFormSetError<T>,
  isKnownPath: (path: string) => boolean,
): string[] {
  const rest: string[] = [];
  for (const issue of issues ?? []) {
    if (issue.path && isKnownPath(issue.path)) setError(issue.path as Path<T>, { type: 'server', message: issue.message });
    else rest.push(issue.message);
  }
  return rest;
}
