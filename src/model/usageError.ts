/**
 * A problem with how fropa was called (a bad option value, a missing path, an unreadable stations file), as
 * opposed to bad data. The CLI maps it to exit code 2 by type (`instanceof UsageError`). It is a RangeError, so a
 * library caller can treat it like any other out-of-range argument.
 */
export class UsageError extends RangeError {
  override name = 'UsageError';
}
