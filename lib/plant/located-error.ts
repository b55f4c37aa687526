/**
 * Errors the calculation finds in a basis that passed validation (a cell voltage above the Nernst
 * voltage, inputs that conflict, a fuel that cannot reach its utilization), located like
 * validation errors: `file:line:col: path: message`, exit code 1.
 */
import { BasisError } from '../basis/diagnostics.ts';
import type { DesignBasis, Diagnostic } from '../basis/types.ts';
import { CalculationError, UserError, type CalculationInput } from '../core/errors.ts';
import type { Finding } from './findings.ts';

function locatedDiagnostic(basis: DesignBasis, path: string, message: string, severity: Diagnostic['severity'] = 'error'): Diagnostic {
  // The value itself, else the nearest written parent (a default has no position of its own).
  let at = basis.positions[`${path}.value`] ?? basis.positions[path];
  let probe = path;
  while (!at && probe.includes('.')) {
    probe = probe.slice(0, probe.lastIndexOf('.'));
    at = basis.positions[probe];
  }
  return { severity, file: basis.file, line: at?.line ?? 1, column: at?.column ?? 1, path, message };
}

/**
 * A finding as the command line and the site build print it, located like a diagnostic:
 * `file:line:col: severity: path: message [code; assumptions A1]`.
 */
export function formatFinding(basis: DesignBasis, f: Finding): string {
  const at = locatedDiagnostic(basis, f.path, f.message, 'warning');
  const assumptions = f.assumptions.length ? `; assumptions ${f.assumptions.join(', ')}` : '';
  return `${at.file}:${at.line}:${at.column}: ${f.severity}: ${f.path}: ${f.message} [${f.code}${assumptions}]`;
}

function locatedError(basis: DesignBasis, path: string, message: string): BasisError {
  return new BasisError([locatedDiagnostic(basis, path, message)]);
}

/**
 * The basis field of each input a CalculationError names. A fuel-electrode feed that cannot be
 * used (no fuel in it, none left before the design point) is reported at the utilization or
 * conversion it cannot reach, as every other error of the fuel path is.
 */
function fieldOf(basis: DesignBasis, input: CalculationInput): string {
  const utilization = basis.cell.mode === 'power' ? 'operating-point.fuel-utilization' : 'operating-point.steam-conversion';
  const fields: Record<CalculationInput, string> = {
    utilization,
    'fuel-electrode-feed': utilization,
    'air-electrode-feed': 'streams.air-electrode',
    'cell-voltage': 'operating-point.cell-voltage',
    'area-specific-resistance': 'operating-point.area-specific-resistance',
    cells: 'operating-point.cells',
    'ionic-transference-number': 'cell.ionic-transference-number',
    'pre-reforming': 'streams.fuel-electrode.pre-reforming',
    'anode-recycle': 'plant.anode-recycle.tolerance',
    'cathode-loop': 'streams.air-electrode.cathode-loop.inlet-oxygen',
    'cells-per-stack': 'plant.electrical.cells-per-stack',
    'stacks-in-series': 'plant.electrical.stacks-in-series',
    'dc-bus-window': 'plant.electrical.dc-bus-window',
    'strings-in-parallel': 'plant.electrical.strings-in-parallel',
    'power-conversion-efficiency': 'operating-point.power-conversion-efficiency',
    'fuel-supply-temperature': 'plant.feed-temperatures.fuel',
    'air-supply-temperature': 'plant.feed-temperatures.air',
    'feed-water-temperature': 'plant.feed-temperatures.water',
    'off-gas-oxidiser': 'plant.off-gas-oxidiser',
    'oxidiser-air-ratio': 'plant.off-gas-oxidiser.air-ratio',
    'exhaust-exit-temperature': 'plant.heat-recovery.exhaust-exit-temperature',
    'hydrogen-compression': 'plant.hydrogen-compression.delivery-pressure',
    'compressor-inlet-temperature': 'plant.hydrogen-compression.inlet-temperature',
    'compression-stage-ratio': 'plant.hydrogen-compression.maximum-stage-ratio',
    'compression-discharge-temperature': 'plant.hydrogen-compression.maximum-discharge-temperature',
  };
  return fields[input];
}

/**
 * Runs a calculation step and turns a UserError of the library into a located error: a
 * CalculationError at the field of the input it names, any other (a temperature outside the
 * species data, an equilibrium that does not converge) at the utilization or conversion, since it
 * arose on the fuel path.
 */
export function locateCalculationErrors<T>(basis: DesignBasis, step: () => T): T {
  try {
    return step();
  } catch (error) {
    if (error instanceof BasisError) throw error;
    if (error instanceof CalculationError) throw locatedError(basis, fieldOf(basis, error.field), error.message);
    if (error instanceof UserError) throw locatedError(basis, fieldOf(basis, 'utilization'), error.message);
    throw error;
  }
}
