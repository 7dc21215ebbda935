import { describe, expect, it } from 'vitest';
import { jobPanelId } from '@panelpass/shared';
import { defaultGauge, vehicleFilm } from './film';
import { JOB, panelsFor, reading } from './testRows';

const panels = panelsFor('suv');
const usual = ['roof', 'hood', 'tailgate', 'left-rear-door', 'right-front-door', 'right-rear-door'];

describe('the film picture of a car', () => {
  it('flags a panel far thicker than the car’s usual film as probably repainted', () => {
    const readings = [
      ...usual.map((k) => reading(k, [110, 114, 112])),
      reading('left-front-door', [245, 249, 246]),
    ];
    const film = vehicleFilm(panels, readings);
    expect(film.baselineUm).toBeCloseTo(112, 6);
    const door = film.panels.find((p) => p.panel.panelKey === 'left-front-door')!;
    expect(door.flags?.flags).toEqual(['probably-repainted']);
    expect(door.flags?.reasons[0]?.message).toMatch(/Probably repainted/);
    expect(door.spots).toHaveLength(1);
    expect(door.spots[0]?.meanUm).toBeCloseTo(246.67, 2);
    expect(door.stats).toMatchObject({ count: 3, minUm: 245, maxUm: 249 });
    const roof = film.panels.find((p) => p.panel.panelKey === 'roof')!;
    expect(roof.flags?.flags).toEqual([]);
  });

  it('keeps the panels in the template’s top-down order, unmeasured ones without flags', () => {
    const film = vehicleFilm(panels, [reading('hood', [100, 101, 102])]);
    expect(film.panels.map((p) => p.panel.panelKey)).toEqual(panels.map((p) => p.panelKey));
    expect(film.panels.find((p) => p.panel.panelKey === 'roof')?.flags).toBeNull();
    expect(film.baselineUm).toBeNull();
    expect(film.reasons[0]?.code).toBe('too-few-panels-for-baseline');
  });

  it('takes each reading row as one spot, and all spots of a panel into its numbers', () => {
    const film = vehicleFilm(panels, [
      reading('hood', [100, 102, 104]),
      reading('hood', [120, 122, 124]),
    ]);
    const hood = film.panels.find((p) => p.panel.panelKey === 'hood')!;
    expect(hood.spots.map((s) => s.meanUm)).toEqual([102, 122]);
    expect(hood.stats).toMatchObject({ count: 6, minUm: 100, maxUm: 124, meanUm: 112 });
  });

  it('leaves out a metal-gauge spot on a panel now set to plastic, and says why', () => {
    const plastic = panels.map((p) => (p.panelKey === 'hood' ? { ...p, substrate: 'plastic' } : p));
    const film = vehicleFilm(plastic, [
      reading('hood', [100, 102, 104], { gaugeType: 'magnetic' }),
    ]);
    const hood = film.panels.find((p) => p.panel.panelKey === 'hood')!;
    expect(hood.spots[0]?.valid).toBe(false);
    expect(hood.stats).toBeNull();
    expect(hood.flags?.reasons[0]?.code).toBe('reading-not-valid');
  });

  it('reads only the phase asked for', () => {
    const film = vehicleFilm(panels, [reading('hood', [100, 100, 100], { phase: 'after' })]);
    expect(film.panels.every((p) => p.spots.length === 0)).toBe(true);
    expect(
      vehicleFilm(panels, [reading('hood', [1, 2, 3], { phase: 'after' })], 'after').panels.find(
        (p) => p.panel.id === jobPanelId(JOB, 'hood'),
      )?.spots,
    ).toHaveLength(1);
  });

  it('offers the gauge last used when it suits the panel, else one that does', () => {
    expect(defaultGauge('steel', 'magnetic')).toBe('magnetic');
    expect(defaultGauge('plastic', 'magnetic')).toBe('ultrasonic');
    expect(defaultGauge('aluminium', null)).toBe('magnetic-eddy');
  });
});
