import { fireEvent, render, screen } from '@testing-library/react-native';
import { ActivityIndicator } from 'react-native';
import { Button, ErrorText, Title } from '../../components/ui';

describe('Button', () => {
  it('calls onPress when pressed', () => {
    const onPress = vi.fn();
    render(<Button label="Save setup" onPress={onPress} />);
    fireEvent.press(screen.getByRole('button', { name: 'Save setup' }));
    expect(onPress).toHaveBeenCalledTimes(1);
  });

  it('does not call onPress while disabled, and says so to assistive tech', () => {
    const onPress = vi.fn();
    render(<Button label="Save setup" onPress={onPress} disabled />);
    const button = screen.getByRole('button', { name: 'Save setup' });
    fireEvent.press(button);
    expect(onPress).not.toHaveBeenCalled();
    expect(button).toBeDisabled();
  });

  it('does not call onPress while busy, and shows a spinner instead of going blank', () => {
    const onPress = vi.fn();
    render(<Button label="Save setup" onPress={onPress} busy />);
    const button = screen.getByRole('button', { name: 'Save setup' });
    fireEvent.press(button);
    expect(onPress).not.toHaveBeenCalled();
    expect(button).toBeBusy();
    expect(screen.getByText('Save setup')).toBeOnTheScreen();
    expect(screen.UNSAFE_getAllByType(ActivityIndicator)).toHaveLength(1);
  });

  it('shows no spinner when idle', () => {
    render(<Button label="Save setup" onPress={() => {}} />);
    expect(screen.UNSAFE_queryAllByType(ActivityIndicator)).toHaveLength(0);
    expect(screen.getByRole('button', { name: 'Save setup' })).toBeEnabled();
  });
});

describe('ErrorText', () => {
  it('is announced as an alert', () => {
    render(<ErrorText>Key light is out of range</ErrorText>);
    expect(screen.getByRole('alert')).toHaveTextContent('Key light is out of range');
  });
});

describe('Title', () => {
  it('is the page heading (level 1)', () => {
    render(<Title>Setups</Title>);
    expect(screen.getByRole('heading', { name: 'Setups' })).toBeOnTheScreen();
  });
});
