/**
 * A bigger model made cheaply from a generated one: the DATA section repeated `copies` times,
 * each copy's entity ids shifted past the previous copy's and its GlobalIds changed in their
 * last character, so every copy is a distinct, valid set of entities. For tests that need a
 * file that takes the reader several seconds without waiting a minute for the generator.
 */
export function replicateModel(bytes: Uint8Array, copies: number): Buffer {
  const text = Buffer.from(bytes).toString('latin1');
  const start = text.indexOf('DATA;') + 'DATA;'.length;
  const end = text.lastIndexOf('ENDSEC;');
  const data = text.slice(start, end);
  let maxId = 0;
  for (const m of data.matchAll(/#(\d+)\s*=/g)) maxId = Math.max(maxId, Number(m[1]));
  const alphabet = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz_$';
  const parts = [text.slice(0, start), data];
  for (let c = 1; c < copies; c++) {
    parts.push(
      data
        .replace(/#(\d+)/g, (_, id: string) => `#${Number(id) + c * maxId}`)
        .replace(/'([0-9A-Za-z_$]{21})([0-9A-Za-z_$])'/g, (_, head: string, last: string) => `'${head}${alphabet[(alphabet.indexOf(last) + c) % 64]}'`),
    );
  }
  parts.push(text.slice(end));
  return Buffer.from(parts.join(''), 'latin1');
}
