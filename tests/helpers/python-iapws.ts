/**
 * Reference values from Debian's python3-iapws (IAPWS-IF97 implementation, an independent code).
 * Runs Debian's own /usr/bin/python3 once for a whole grid (JSON in, JSON out), never per point:
 * another `python3` earlier on PATH may not see Debian's packages.
 */
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';

export const DEBIAN_PYTHON = '/usr/bin/python3';

export type IapwsQuery =
  { kind: 'psat'; tK: number } | { kind: 'tsat'; pMpa: number } | { kind: 'region1'; tK: number; pMpa: number } | { kind: 'region2'; tK: number; pMpa: number };

export interface IapwsAnswer {
  /** psat in MPa, or Tsat in K */
  value?: number;
  v?: number;
  h?: number;
  s?: number;
  cp?: number;
}

const SCRIPT = `
import json, sys
from iapws.iapws97 import _PSat_T, _TSat_P, _Region1, _Region2
out = []
for q in json.load(sys.stdin):
    k = q["kind"]
    if k == "psat":
        out.append({"value": _PSat_T(q["tK"])})
    elif k == "tsat":
        out.append({"value": _TSat_P(q["pMpa"])})
    else:
        r = (_Region1 if k == "region1" else _Region2)(q["tK"], q["pMpa"])
        out.append({"v": r["v"], "h": r["h"], "s": r["s"], "cp": r["cp"]})
json.dump(out, sys.stdout)
`;

export function pythonIapwsAvailable(): boolean {
  if (!existsSync(DEBIAN_PYTHON)) return false;
  try {
    execFileSync(DEBIAN_PYTHON, ['-c', 'import iapws'], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

export function pythonIapwsVersion(): string {
  return execFileSync(DEBIAN_PYTHON, ['-c', 'import iapws; print(iapws.__version__)'], { encoding: 'utf8' }).trim();
}

/** Evaluates the whole grid in one child process. */
export function queryPythonIapws(queries: IapwsQuery[]): IapwsAnswer[] {
  const text = execFileSync(DEBIAN_PYTHON, ['-c', SCRIPT], {
    input: JSON.stringify(queries),
    encoding: 'utf8',
    maxBuffer: 64 * 1024 * 1024,
  });
  const answers = JSON.parse(text) as IapwsAnswer[];
  if (answers.length !== queries.length) throw new Error(`python3-iapws returned ${answers.length} answers for ${queries.length} queries`);
  return answers;
}
