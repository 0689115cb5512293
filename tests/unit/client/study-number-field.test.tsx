import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { useState } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { UnitNumberInput } from '#src/features/studies/components/editor/fields';
import { UnitSystemProvider } from '#src/lib/quantities';

afterEach(cleanup);

describe('UnitNumberInput', () => {
  it('shows an SI value in the user’s unit and stores what is typed back in SI', () => {
    const onChange = vi.fn();
    render(
      <UnitSystemProvider system="us">
        <UnitNumberInput label="Base fuel pressure" value={400_000} quantity="pressureGauge" onChange={onChange} />
      </UnitSystemProvider>,
    );
    const input = screen.getByLabelText('Base fuel pressure') as HTMLInputElement;
    expect(input.value).toBe('58.015'); // 400 kPa in psi, 5 significant figures (1 psi = 6894.757 Pa, NIST SP 811)
    expect(screen.getByText('psi gauge')).toBeTruthy();
    fireEvent.change(input, { target: { value: '60' } });
    expect(onChange).toHaveBeenLastCalledWith(expect.closeTo(413_685.4, 1)); // 60 psi = 413 685.4 Pa (NIST SP 811)
  });

  it('keeps a half-typed or wrong number as typed, says what is wrong, and stores nothing', () => {
    const onChange = vi.fn();
    render(<UnitNumberInput label="Displacement" value={0.002} quantity="volume" onChange={onChange} />);
    const input = screen.getByLabelText('Displacement') as HTMLInputElement;
    fireEvent.focus(input);
    fireEvent.change(input, { target: { value: '2,1' } });
    expect(onChange).not.toHaveBeenCalled();
    expect(input.value).toBe('2,1');
    expect(input.getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByText('Use a point for decimals (1.5, not 1,5).')).toBeTruthy();
    fireEvent.blur(input);
    expect(input.value).toBe('2,1'); // still there to fix, not silently replaced
    fireEvent.change(input, { target: { value: '2.1' } });
    expect(onChange).toHaveBeenLastCalledWith(expect.closeTo(0.0021, 12)); // L to m³, definition
  });

  it('clears an optional value with an empty box, and refuses an empty required one', () => {
    const onChange = vi.fn();
    const { rerender } = render(<UnitNumberInput label="Rpm limit" value={8200} quantity="speed" optional onChange={onChange} />);
    fireEvent.change(screen.getByLabelText('Rpm limit'), { target: { value: '' } });
    expect(onChange).toHaveBeenLastCalledWith(undefined);
    rerender(<UnitNumberInput label="Cylinders" value={4} quantity="count" onChange={onChange} />);
    onChange.mockClear();
    fireEvent.change(screen.getByLabelText('Cylinders'), { target: { value: '' } });
    expect(onChange).not.toHaveBeenCalled();
    expect(screen.getByText('Type a number.')).toBeTruthy();
  });

  it('converts a temperature rise by factor only', () => {
    const onChange = vi.fn();
    render(
      <UnitSystemProvider system="us">
        <UnitNumberInput label="Intake heating" value={5} quantity="temperatureDifference" onChange={onChange} />
      </UnitSystemProvider>,
    );
    const input = screen.getByLabelText('Intake heating') as HTMLInputElement;
    expect(input.value).toBe('9'); // 5 K = 9 °F of difference (1 K = 1.8 °F, NIST SP 811), not 41 °F
    fireEvent.change(input, { target: { value: '18' } });
    expect(onChange).toHaveBeenLastCalledWith(10);
  });

  it('follows a value changed elsewhere (another unit system, a loaded revision) when not being typed in', () => {
    function Host() {
      const [system, setSystem] = useState<'si' | 'us'>('si');
      return (
        <UnitSystemProvider system={system}>
          <button type="button" onClick={() => setSystem('us')}>
            US
          </button>
          <UnitNumberInput label="Air temperature" value={293.15} quantity="temperature" onChange={() => undefined} />
        </UnitSystemProvider>
      );
    }
    render(<Host />);
    const input = screen.getByLabelText('Air temperature') as HTMLInputElement;
    expect(input.value).toBe('20'); // 293.15 K = 20 °C (definition of the Celsius scale)
    fireEvent.click(screen.getByText('US'));
    expect(input.value).toBe('68'); // 20 °C = 68 °F (NIST SP 811)
  });
});
