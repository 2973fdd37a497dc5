/**
 * A small CSV reader written to RFC 4180 §2 for the tests (not the writer under test): records
 * end with CRLF, fields are separated by commas, a field in double quotes may hold commas, CR,
 * LF and doubled quotes. Throws on anything the grammar does not allow (a bare quote inside an
 * unquoted field, text after a closing quote, a record not ended by CRLF, ragged records).
 */
export function parseRfc4180(text: string): string[][] {
  const records: string[][] = [];
  let record: string[] = [];
  let i = 0;
  while (i < text.length) {
    let field = '';
    if (text[i] === '"') {
      i++;
      for (;;) {
        if (i >= text.length) throw new Error('unterminated quoted field');
        if (text[i] === '"') {
          if (text[i + 1] === '"') {
            field += '"';
            i += 2;
            continue;
          }
          i++;
          break;
        }
        field += text[i++];
      }
    } else {
      while (i < text.length && text[i] !== ',' && text[i] !== '\r' && text[i] !== '\n') {
        if (text[i] === '"') throw new Error(`bare quote in an unquoted field at ${i}`);
        field += text[i++];
      }
    }
    record.push(field);
    if (text[i] === ',') {
      i++;
      continue;
    }
    if (text[i] === '\r' && text[i + 1] === '\n') {
      records.push(record);
      record = [];
      i += 2;
      continue;
    }
    throw new Error(`expected a comma or CRLF at ${i}, found ${JSON.stringify(text[i] ?? 'end of text')}`);
  }
  if (record.length > 0) throw new Error('last record not ended by CRLF');
  const width = records[0]?.length ?? 0;
  records.forEach((r, n) => {
    if (r.length !== width) throw new Error(`record ${n} has ${r.length} fields, the header ${width}`);
  });
  return records;
}
