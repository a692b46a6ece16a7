// A JSON column read through plain SQL: MariaDB stores JSON as text, and the driver hands it back
// as a string (a model read parses it; a raw row does not). Already parsed values pass through.
export function jsonColumn<T>(value: T | string): T {
  return typeof value === 'string' ? (JSON.parse(value) as T) : value;
}
