/**
 * The `document:` section: document control (title, number, client, site, paper, purpose,
 * scope) and the sign-off, warning where the sign-off dates run backwards. The revision and its
 * status are the archive's (lib/archive); what an issue requires of the sign-off is checked when
 * a revision is issued.
 */
import { allDefined, type Reader } from './reader.ts';
import type { DocumentInfo, Signatory } from './types.ts';

type Role = 'prepared' | 'checked' | 'approved';

function signatory(reader: Reader, role: Role): Signatory | undefined {
  const path = ['document', 'sign-off', role];
  const name = reader.text([...path, 'name']);
  if (name === undefined) return undefined;
  const date = reader.text([...path, 'date']);
  return date === undefined ? { name } : { name, date };
}

function checkSignOff(reader: Reader, signOff: DocumentInfo['signOff']): void {
  const order: Role[] = ['prepared', 'checked', 'approved'];
  for (let i = 1; i < order.length; i++) {
    const earlier = signOff[order[i - 1]!]?.date;
    const later = signOff[order[i]!]?.date;
    if (earlier && later && later < earlier) {
      reader.findings.warning(['document', 'sign-off', order[i]!, 'date'], `${order[i]} on ${later}, before it was ${order[i - 1]} on ${earlier}`);
    }
  }
}

export function readDocument(reader: Reader): DocumentInfo | undefined {
  const field = (key: string) => reader.text(['document', key]);
  const signOff: DocumentInfo['signOff'] = {};
  for (const role of ['prepared', 'checked', 'approved'] as const) {
    const person = signatory(reader, role);
    if (person) signOff[role] = person;
  }
  checkSignOff(reader, signOff);
  const required = allDefined({
    title: field('title'),
    number: field('number'),
    client: field('client'),
    site: field('site'),
    purpose: field('purpose'),
    scope: field('scope'),
    prepared: signOff.prepared,
  });
  if (!required) return undefined;
  const { prepared: _prepared, ...info } = required;
  return { ...info, paper: field('paper') === 'Letter' ? 'Letter' : 'A4', signOff };
}
