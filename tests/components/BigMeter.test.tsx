// A lesson's big meter (and the assignment and review screens that share it) reads key:fill as the editor does:
// the silver card under a clamshell's chin is the fill (it sends the key back to the shadow side), so the ratio
// shows with the card named as a panel, never "needs a fill light".
import { render, screen } from '@testing-library/react';
import { BigMeter } from '../../components/classes/LessonPlayer';
import { demoSetups } from '../../db/seed-setups';
import { computeReadings } from '../../model/setupReadings';

const clamshell = demoSetups.find((d) => d.title.startsWith('Clamshell'))!.document;

test('the clamshell card counts as the fill in a lesson, named as a panel', () => {
  const readings = computeReadings(clamshell);
  const kf = readings.meter!.keyFill;
  expect(kf.fillPanels.panelIds.length).toBe(1);
  render(<BigMeter readings={readings} big />);
  expect(screen.getByTestId('step-meter-keyfill').textContent).toBe(`${kf.ratio!.toFixed(1)}:1`);
  expect(screen.getByText(`${kf.ratioStops!.toFixed(1)} stops, fill side with the key off 1 panel`)).toBeTruthy();
  expect(screen.queryByText(/needs a fill/)).toBeNull();
});

test('with no fill of any kind it says what is missing, a reflector included', () => {
  const noCard = { ...clamshell, items: clamshell.items.filter((i) => i.kind !== 'reflector') };
  render(<BigMeter readings={computeReadings(noCard)} />);
  expect(screen.getByTestId('step-meter-keyfill').textContent).toBe('—');
  expect(screen.getByText('needs a key and a fill (a light or a reflector)')).toBeTruthy();
});
