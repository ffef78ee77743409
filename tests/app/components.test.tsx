import { fireEvent, render, screen } from '@testing-library/react-native';
import { Button } from '../../components/ui/Button';
import { TextField } from '../../components/ui/TextField';
import { sectionOfPath } from '../../components/layout/navigation';

describe('Button', () => {
  it('calls back when pressed and not when busy', () => {
    const onPress = jest.fn();
    const { rerender } = render(<Button label="Run trial" onPress={onPress} />);
    fireEvent.press(screen.getByRole('button', { name: 'Run trial' }));
    expect(onPress).toHaveBeenCalledTimes(1);
    rerender(<Button label="Run trial" onPress={onPress} busy />);
    fireEvent.press(screen.getByRole('button', { name: 'Run trial' }));
    expect(onPress).toHaveBeenCalledTimes(1);
  });
});

describe('TextField', () => {
  it('shows its field message under the input', () => {
    render(<TextField label="E-mail" value="" error="That does not look like an e-mail address." />);
    expect(screen.getByText('That does not look like an e-mail address.')).toBeTruthy();
    expect(screen.getByLabelText('E-mail')).toBeTruthy();
  });
});

describe('sectionOfPath', () => {
  it('maps nested paths to their section and unknown ones to Home', () => {
    expect(sectionOfPath('/characters/12').label).toBe('Characters');
    expect(sectionOfPath('/').label).toBe('Home');
    expect(sectionOfPath('/nowhere').label).toBe('Home');
  });
});
