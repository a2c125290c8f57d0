// The one error type for a project file or project document that breaks the schema.

/** A project document that is not valid; the message is one line and names the field (and the file when known). */
export class ProjectFormatError extends Error {
  override readonly name = 'ProjectFormatError';
}

/** Throw a ProjectFormatError saying `where` is wrong. */
export function badField(where: string, expectation: string): never {
  throw new ProjectFormatError(`${where} ${expectation}`);
}
