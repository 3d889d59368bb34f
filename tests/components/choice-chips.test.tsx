import { fireEvent, render, screen } from '@testing-library/react-native';
import { useState } from 'react';
import { ChoiceChips } from '@/components/ui/choice-chips';

const sizes = [
  { value: 'deep', label: 'Deep' },
  { value: 'medium', label: 'Medium' },
  { value: 'shallow', label: 'Shallow' },
] as const;
type Size = (typeof sizes)[number]['value'];

function Single({ initial, onChange }: { initial: Size | null; onChange?: (v: Size) => void }) {
  const [value, setValue] = useState<Size | null>(initial);
  return (
    <ChoiceChips
      field="box-0-size"
      label="Size of box 1"
      options={sizes}
      value={value}
      onChange={(v) => {
        setValue(v);
        onChange?.(v);
      }}
    />
  );
}

const signs = [
  { value: 'chalkbrood', label: 'Chalkbrood' },
  { value: 'deformed-wings', label: 'Deformed wings' },
  { value: 'small-hive-beetle', label: 'Small hive beetle' },
] as const;
type Sign = (typeof signs)[number]['value'];

function Multi({ onChange }: { onChange?: (v: Sign[]) => void }) {
  const [value, setValue] = useState<Sign[]>([]);
  return (
    <ChoiceChips
      multiple
      field="signs"
      label="Disease and pest signs"
      options={signs}
      value={value}
      onChange={(v) => {
        setValue(v);
        onChange?.(v);
      }}
    />
  );
}

describe('ChoiceChips, single choice', () => {
  it('is a radio group whose chips report which one is checked', () => {
    render(<Single initial="deep" />);
    expect(screen.getByTestId('chips-box-0-size')).toBeOnTheScreen();
    expect(screen.getByRole('radio', { name: 'Deep' })).toBeChecked();
    expect(screen.getByRole('radio', { name: 'Medium' })).not.toBeChecked();
    expect(screen.getByTestId('chips-box-0-size-deep')).toBeChecked();
    expect(screen.getByTestId('chips-box-0-size-deep')).toBeSelected();
  });

  it('moves the choice to the tapped chip', () => {
    const onChange = jest.fn();
    render(<Single initial="deep" onChange={onChange} />);
    fireEvent.press(screen.getByTestId('chips-box-0-size-shallow'));
    expect(onChange).toHaveBeenCalledWith('shallow');
    expect(screen.getByRole('radio', { name: 'Shallow' })).toBeChecked();
    expect(screen.getByRole('radio', { name: 'Deep' })).not.toBeChecked();
  });

  it('keeps the choice when the chosen chip is tapped again', () => {
    const onChange = jest.fn();
    render(<Single initial="medium" onChange={onChange} />);
    fireEvent.press(screen.getByTestId('chips-box-0-size-medium'));
    expect(onChange).not.toHaveBeenCalled();
    expect(screen.getByRole('radio', { name: 'Medium' })).toBeChecked();
  });

  it('starts with nothing chosen when the value is null', () => {
    render(<Single initial={null} />);
    for (const name of ['Deep', 'Medium', 'Shallow']) expect(screen.getByRole('radio', { name })).not.toBeChecked();
  });
});

describe('ChoiceChips, multiple choice', () => {
  it('is a set of checkboxes that toggle independently, in the options’ order', () => {
    const onChange = jest.fn();
    render(<Multi onChange={onChange} />);
    fireEvent.press(screen.getByTestId('chips-signs-small-hive-beetle'));
    fireEvent.press(screen.getByTestId('chips-signs-chalkbrood'));
    expect(onChange).toHaveBeenLastCalledWith(['chalkbrood', 'small-hive-beetle']);
    expect(screen.getByRole('checkbox', { name: 'Chalkbrood' })).toBeChecked();
    expect(screen.getByRole('checkbox', { name: 'Small hive beetle' })).toBeChecked();
    expect(screen.getByRole('checkbox', { name: 'Deformed wings' })).not.toBeChecked();

    fireEvent.press(screen.getByTestId('chips-signs-chalkbrood'));
    expect(onChange).toHaveBeenLastCalledWith(['small-hive-beetle']);
    expect(screen.getByRole('checkbox', { name: 'Chalkbrood' })).not.toBeChecked();
  });
});
