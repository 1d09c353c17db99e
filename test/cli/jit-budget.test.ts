// The V8 tiering budget raised for a scoring run's start-up (src/cli/jit-budget.ts). The values
// are V8 11.3's (Node 20): its default budget, 67,584, is what `node --v8-options` prints for
// --interrupt-budget on Node 20.20; the raised value is ours, measured with npm run bench.
import { describe, expect, it } from 'vitest';
import { jitBudgetFlags } from '../../src/cli/jit-budget.js';

describe('jitBudgetFlags', () => {
  it('raises the budget on the V8 that was measured and restores its default', () => {
    expect(jitBudgetFlags('11.3.244.8-node.38', [], undefined)).toEqual({ raise: '--interrupt-budget=1000000', restore: '--interrupt-budget=67584' });
  });

  it('changes nothing on another V8, whose default may differ', () => {
    expect(jitBudgetFlags('12.4.254.21-node.33', [], undefined)).toBeUndefined();
    expect(jitBudgetFlags('11.8.172.17-node.19', [], undefined)).toBeUndefined();
  });

  it('leaves a budget the user set alone (command line or NODE_OPTIONS, either spelling)', () => {
    expect(jitBudgetFlags('11.3.244.8-node.38', ['--interrupt-budget=200000'], undefined)).toBeUndefined();
    expect(jitBudgetFlags('11.3.244.8-node.38', [], '--max-old-space-size=4096 --interrupt_budget=5000')).toBeUndefined();
    expect(jitBudgetFlags('11.3.244.8-node.38', ['--interrupt-budget-for-feedback-allocation=10'], '--trace-gc')).toEqual({ raise: '--interrupt-budget=1000000', restore: '--interrupt-budget=67584' });
  });

  // Runs on Node 20 (V8 11.3), the engine CI uses.
  it.runIf(process.versions.v8.startsWith('11.3.'))("restores this process's V8 default (node --v8-options)", async () => {
    const { execFileSync } = await import('node:child_process');
    const options = execFileSync(process.execPath, ['--v8-options'], { encoding: 'utf8' });
    expect(options).toMatch(/--interrupt-budget \(.*\)\n\s+type: int\s+default: --interrupt-budget=67584/);
  });
});
