import { fireEvent, render, screen } from '@testing-library/react';
import { Button, ErrorText, Title } from '../../components/ui';

describe('Button', () => {
  it('calls onPress when pressed', () => {
    const onPress = vi.fn();
    render(<Button label="Save setup" onPress={onPress} />);
    fireEvent.click(screen.getByRole('button', { name: 'Save setup' }));
    expect(onPress).toHaveBeenCalledTimes(1);
  });

  it('does not call onPress while disabled, and says so to assistive tech', () => {
    const onPress = vi.fn();
    render(<Button label="Save setup" onPress={onPress} disabled />);
    const button = screen.getByRole('button', { name: 'Save setup' });
    fireEvent.click(button);
    expect(onPress).not.toHaveBeenCalled();
    expect(button).toBeDisabled();
  });

  it('does not call onPress while busy, and shows a spinner instead of going blank', () => {
    const onPress = vi.fn();
    render(<Button label="Save setup" onPress={onPress} busy />);
    const button = screen.getByRole('button', { name: 'Save setup' });
    fireEvent.click(button);
    expect(onPress).not.toHaveBeenCalled();
    expect(button).toHaveAttribute('aria-busy', 'true');
    expect(screen.getByText('Save setup')).toBeInTheDocument();
    expect(screen.getAllByRole('progressbar')).toHaveLength(1);
  });

  it('shows no spinner when idle', () => {
    render(<Button label="Save setup" onPress={() => {}} />);
    expect(screen.queryAllByRole('progressbar')).toHaveLength(0);
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
    expect(screen.getByRole('heading', { name: 'Setups' })).toBeInTheDocument();
  });
});
