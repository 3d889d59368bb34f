import { fireEvent, render, screen } from '@testing-library/react-native';
import { useState } from 'react';
import { Stepper, formatStepperValue, stepValue, type StepperProps } from '@/components/ui/stepper';

/** A stepper that holds its own value, as a form would. */
function Harness(props: Omit<StepperProps, 'value' | 'onChange'> & { initial: number; onChange?: (v: number) => void }) {
  const { initial, onChange, ...rest } = props;
  const [value, setValue] = useState(initial);
  return (
    <Stepper
      {...rest}
      value={value}
      onChange={(v) => {
        setValue(v);
        onChange?.(v);
      }}
    />
  );
}

const brood = {
  field: 'brood',
  label: 'Frames of brood',
  decreaseLabel: 'Fewer frames of brood',
  increaseLabel: 'More frames of brood',
};

describe('Stepper', () => {
  it('reads its value in its accessible name and follows changes', () => {
    render(<Harness {...brood} initial={6} min={0} max={10} />);
    expect(screen.getByLabelText('Frames of brood: 6')).toBeOnTheScreen();
    fireEvent.press(screen.getByRole('button', { name: 'More frames of brood' }));
    expect(screen.getByLabelText('Frames of brood: 7')).toBeOnTheScreen();
    expect(screen.getByTestId('stepper-brood-value')).toHaveTextContent('7');
    fireEvent.press(screen.getByRole('button', { name: 'Fewer frames of brood' }));
    fireEvent.press(screen.getByRole('button', { name: 'Fewer frames of brood' }));
    expect(screen.getByLabelText('Frames of brood: 5')).toBeOnTheScreen();
  });

  it('cannot go below its minimum, and its decrease button is disabled there', () => {
    const onChange = jest.fn();
    render(<Harness {...brood} initial={1} min={0} max={10} onChange={onChange} />);
    fireEvent.press(screen.getByTestId('stepper-brood-dec'));
    expect(screen.getByTestId('stepper-brood-value')).toHaveTextContent('0');
    expect(screen.getByTestId('stepper-brood-dec')).toBeDisabled();
    expect(screen.getByTestId('stepper-brood-inc')).toBeEnabled();
    fireEvent.press(screen.getByTestId('stepper-brood-dec'));
    expect(screen.getByTestId('stepper-brood-value')).toHaveTextContent('0');
    expect(onChange).toHaveBeenCalledTimes(1);
  });

  it('cannot go above its maximum, and its increase button is disabled there', () => {
    const onChange = jest.fn();
    render(<Harness {...brood} initial={9} min={0} max={10} onChange={onChange} />);
    fireEvent.press(screen.getByTestId('stepper-brood-inc'));
    expect(screen.getByLabelText('Frames of brood: 10')).toBeOnTheScreen();
    expect(screen.getByTestId('stepper-brood-inc')).toBeDisabled();
    fireEvent.press(screen.getByTestId('stepper-brood-inc'));
    expect(screen.getByTestId('stepper-brood-value')).toHaveTextContent('10');
    expect(onChange).toHaveBeenCalledTimes(1);
  });

  it('steps in halves, writing ½ and reading the decimal', () => {
    render(<Harness {...brood} initial={6} min={0} max={10} step={0.5} />);
    fireEvent.press(screen.getByTestId('stepper-brood-inc'));
    expect(screen.getByTestId('stepper-brood-value')).toHaveTextContent('6½');
    expect(screen.getByLabelText('Frames of brood: 6.5')).toBeOnTheScreen();
    fireEvent.press(screen.getByTestId('stepper-brood-inc'));
    expect(screen.getByLabelText('Frames of brood: 7')).toBeOnTheScreen();
  });

  it('stops a half step exactly at the limit', () => {
    render(<Harness {...brood} initial={0.5} min={0} max={1} step={0.5} />);
    fireEvent.press(screen.getByTestId('stepper-brood-dec'));
    expect(screen.getByTestId('stepper-brood-value')).toHaveTextContent('0');
    expect(screen.getByTestId('stepper-brood-dec')).toBeDisabled();
  });

  it('names its buttons after the label when no trade wording is given', () => {
    render(<Harness field="mites" label="Mites found" initial={0} min={0} max={300} />);
    expect(screen.getByRole('button', { name: 'Increase Mites found' })).toBeEnabled();
    expect(screen.getByRole('button', { name: 'Decrease Mites found' })).toBeDisabled();
  });
});

describe('stepValue', () => {
  it.each([
    // [value, direction, limits, expected, why]
    [6, 1, { min: 0, max: 10 }, 7, 'one whole step up'],
    [0, -1, { min: 0, max: 10 }, 0, 'clamped at the minimum'],
    [10, 1, { min: 0, max: 10 }, 10, 'clamped at the maximum'],
    [6.5, 1, { min: 0, max: 10, step: 0.5 }, 7, 'half step up'],
    [0.3, 1, { min: 0, max: 1, step: 0.1 }, 0.4, 'decimal steps do not drift (0.30000000000000004)'],
    [6.3, 1, { min: 0, max: 10, step: 0.5 }, 7, 'an off-grid value snaps to the grid (6.5) then steps'],
  ] as const)('%p %p within %j → %p (%s)', (value, direction, limits, expected, _why) => {
    expect(stepValue(value, direction, limits)).toBe(expected);
  });
});

describe('formatStepperValue', () => {
  it.each([
    [0, '0'],
    [0.5, '½'],
    [6, '6'],
    [6.5, '6½'],
    [1.25, '1.25'],
  ])('%p is written %p', (value, written) => {
    expect(formatStepperValue(value)).toBe(written);
  });
});
