/** One problem an audit found: a line saying what failed, and lines of detail below it. */
export interface AuditFinding {
  reason: string;
  details: string[];
}

export function finding(reason: string, ...details: string[]): AuditFinding {
  return { reason, details };
}
