/** Node's flags for an app process sized to APP_PROCESS_CORES (scripts/lib/process-cores.mjs). */
import { describe, expect, it } from 'vitest';
import { missingNodeFlags, nodeFlagsForCores } from '../../../scripts/lib/process-cores.mjs';

describe('APP_PROCESS_CORES node flags', () => {
  it('unset or blank: node as it is (npm start on its own machine)', () => {
    expect(nodeFlagsForCores(undefined)).toEqual([]);
    expect(nodeFlagsForCores('')).toEqual([]);
    expect(nodeFlagsForCores('  ')).toEqual([]);
  });

  it('one core: the garbage collector on the thread whose heap it is', () => {
    expect(nodeFlagsForCores('1')).toEqual(['--single-threaded-gc']);
  });

  it('more cores: no flags, the share only sets the worker threads', () => {
    for (const cores of ['2', '3', '4', '16', '256']) expect(nodeFlagsForCores(cores)).toEqual([]);
  });

  it('anything but a whole number from 1 to 256 is refused, naming the setting and the value', () => {
    for (const bad of ['0', '-1', '1.5', 'one', '257', '1e9']) {
      expect(() => nodeFlagsForCores(bad)).toThrow(`APP_PROCESS_CORES must be a whole number of cores from 1 to 256, not "${bad}"`);
    }
  });

  it('says which wanted flags a process was started without', () => {
    expect(missingNodeFlags('1', [])).toEqual(['--single-threaded-gc']);
    expect(missingNodeFlags('1', ['--enable-source-maps', '--single-threaded-gc'])).toEqual([]);
    expect(missingNodeFlags('2', [])).toEqual([]);
    expect(missingNodeFlags(undefined, [])).toEqual([]);
  });
});
