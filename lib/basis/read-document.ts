/**
 * The `document:` section: document control (title, number, revision, status, client, site,
 * paper, purpose, scope) and the sign-off. Warns where the status claims more than the
 * sign-off records (approved without an approver) and where the dates run backwards.
 */
import { allDefined, type Reader } from './reader.ts';
import type { DocumentInfo, DocumentStatus, Signatory } from './types.ts';

type Role = 'prepared' | 'checked' | 'approved';

function signatory(reader: Reader, role: Role): Signatory | undefined {
  const path = ['document', 'sign-off', role];
  const name = reader.text([...path, 'name']);
  if (name === undefined) return undefined;
  const date = reader.text([...path, 'date']);
  return date === undefined ? { name } : { name, date };
}

function checkSignOff(reader: Reader, status: DocumentStatus | undefined, signOff: DocumentInfo['signOff']): void {
  if (status === 'approved' && !signOff.approved && !reader.has(['document', 'sign-off', 'approved'])) {
    reader.findings.warning(['document', 'status'], 'the status is approved but sign-off has no approved: { name, date }');
  }
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
  const status = field('status') as DocumentStatus | undefined;
  const signOff: DocumentInfo['signOff'] = {};
  for (const role of ['prepared', 'checked', 'approved'] as const) {
    const person = signatory(reader, role);
    if (person) signOff[role] = person;
  }
  checkSignOff(reader, status, signOff);
  const required = allDefined({
    title: field('title'),
    number: field('number'),
    revision: field('revision'),
    status,
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
