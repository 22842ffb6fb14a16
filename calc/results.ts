/**
 * What the meter returns: the result types of `meter(scene)`. Exposures are luminous exposure H in lux·s under
 * the camera's shutter; f-numbers are what a flat-receptor incident meter would read at the camera's ISO;
 * stops are log2 ratios (+1 = one stop more light).
 */
import type { Rgb } from './colour';
import type { LightRole, ReceptorId } from './sceneSchema';
import type { Vec3 } from './vec';

/** Exposure at one receptor, lights only. */
export type PointReading = {
  /** Total luminous exposure, lux·s (direct + one bounce). */
  luxSeconds: number;
  directLuxSeconds: number;
  bounceLuxSeconds: number;
  /** f-number an incident meter would read at the camera's ISO; null when no light arrives. */
  aperture: number | null;
  /**
   * Stops over (+) or under (−) a correct exposure at the camera's aperture, shutter, ISO and ND;
   * null when no light arrives.
   */
  stopsVsCamera: number | null;
  /** Plain words when the reading is blank or needs a word ("more than 12 stops under: black in the frame"). */
  note?: string;
};

/** One light alone (or the total) by each receptor, lux·s (direct + every bounce). */
export type ByReceptor = Record<ReceptorId, number>;

/** What the camera records at a point of the background, per camera channel (linear sRGB, white-balanced). */
export type RecordedTone = {
  /** Stops over (+) or under (−) a correctly exposed mid-grey (18 %), per channel R, G, B. */
  stops: [number | null, number | null, number | null];
  /** The colour the camera records there (light × surface colour, white-balanced, sRGB-encoded; a correctly exposed mid-grey is #767676). */
  hex: string | null;
  /** Some channel is over the clipping rule (CLIP_STOPS). */
  clipped: boolean;
  /** Every channel is under the blocked-up rule (BLOCKED_STOPS). */
  blocked: boolean;
};

/** Mixed colour at a receptor. */
export type ColourReading = {
  /** Hue as rendered with the camera's white balance (brightest channel = ff). */
  hex: string;
  /** Hue relative to the sRGB (D65) display white, no white balance. */
  absoluteHex: string;
  /** Correlated colour temperature (McCamy), K; null when the colour is far from the Planckian locus. */
  cctK: number | null;
  /** Linear sRGB of the mix, scaled to relative luminance 1. */
  linearRgb: Rgb;
};

export type PowerAdvice = {
  /** Stops to change this light by so that it alone reads the target aperture at the subject; null if it does not reach it. */
  stopsChange: number | null;
  /** Power fraction that gives it; null when it does not reach the subject. May be > 1 or < minimum (see flags). */
  fraction: number | null;
  /** The fraction needed is above full power. */
  beyondFull: boolean;
  /** The fraction needed is below the light's lowest setting. */
  belowMinimum: boolean;
};

/** Rim, hair and kicker: level over the key, each read pointed at its light. */
export type VsKeyAdvice = {
  /** This light over the key, stops (both read by a flat disc pointed at the light); null if either is dark. */
  stops: number | null;
  targetStops: number;
  /** Stops to change this light by to reach the target; null when unknown. */
  stopsChange: number | null;
  fraction: number | null;
  beyondFull: boolean;
  belowMinimum: boolean;
};

export type LightReading = PointReading & {
  id: string;
  kind: 'flash' | 'continuous';
  enabled: boolean;
  /** Role as set in the scene. */
  role: LightRole;
  /** Role the meter used for key:fill. */
  ratioRole: 'key' | 'fill' | 'none';
  calibrated: boolean;
  /** 3-D distance from the light to the subject, m. */
  distanceM: number;
  /** Angle between the subject's facing and the direction to the light, degrees (≥ 90: from behind). */
  incidenceDeg: number;
  /** Angle between the beam axis and the direction to the subject, degrees. */
  offAxisDeg: number;
  /** Fraction of direct light passed by flags and walls (1 = clear, 0 = shadowed). */
  transmission: number;
  /** Colour temperature after the gel, K, and the light's hue with the camera's white balance. */
  kelvin: number;
  colourHex: string;
  /** On-axis cd·s at the current power after modifier and gel (continuous: cd × shutter). */
  axialCdS: number;
  /** Flash only: equivalent guide number (m, ISO 100) at the current power with its modifier and gel. */
  guideNumberM: number | null;
  powerFraction: number;
  /** Current power in stops below full (1/8 → −3). */
  powerStops: number;
  minPowerFraction: number;
  /**
   * Key, fill and auto lights: power for the target aperture (after the ambient's share). For rim, hair,
   * kicker, background and other lights this is informational only (no warning): their job is not the
   * subject's exposure.
   */
  forTarget: PowerAdvice;
  /** The reading of a flat disc at the subject pointed at this light (the per-light reading for ratios). */
  pointed: PointReading;
  /** This light alone at the subject by each receptor, lux·s. */
  byReceptor: ByReceptor;
  /** Rim, hair and kicker only: level over the key and the change to reach the target. */
  vsKey: VsKeyAdvice | null;
  /** This light's own tone on the background (as the camera records it), for background lights; null otherwise or with no background. */
  backgroundTone: RecordedTone | null;
  /** This light at the background, stops relative to this light at the subject; null if either is dark. */
  backgroundStopsVsSubject: number | null;
};

export type MeterWarning = {
  code:
    | 'shutter-faster-than-sync'
    | 'no-light-on-subject'
    | 'beyond-full-power'
    | 'below-minimum-power'
    | 'light-behind-subject-facing'
    | 'background-clips'
    | 'background-blocked'
    | 'ambient-over-target';
  lightId?: string;
  message: string;
};

export type MeterResult = {
  camera: {
    ev100: number;
    horizontalAovDeg: number;
    verticalAovDeg: number;
    syncSpeedS: number;
    /** The shutter is faster than the sync speed while a flash is on (flash would be cut off; no high-speed sync modelled). */
    overSync: boolean;
  };
  /** Target f-number used for power advice. */
  targetAperture: number;
  /** The receptor the exposure readings (subject, lights[].aperture, stopsVsCamera) are by. */
  receptor: ReceptorId;
  /** The lights' total at the subject by each receptor, lux·s. */
  subjectByReceptor: ByReceptor;
  /** Inter-reflection: radiosity passes used and whether it met its tolerance within the bound. */
  bounces: { passes: number; converged: boolean };
  subject: PointReading & { colour: ColourReading | null };
  lights: LightReading[];
  keyFill: {
    keyId: string | null;
    fillIds: string[];
    /** key:fill as the key's exposure over the fill's (each metered alone): 2 → "2:1", one stop. */
    ratio: number | null;
    ratioStops: number | null;
    /** (key + fill):fill, the lit side over the shadow side. */
    litToShadowRatio: number | null;
    /**
     * The key's light returned to the face by panels on the fill side (reflectors and v-flats more than
     * FILL_SIDE_MIN_DEG around the subject from the key), lux·s: counted in the fill side of the ratio and taken
     * out of the key's side. Read pointed at each panel (flat-face receptor: by the face's disc).
     */
    fillPanels: { luxSeconds: number; panelIds: string[] };
    /** How the key and fill were chosen: from roles set in the scene, or automatically. */
    rule: 'roles' | 'brightest';
  };
  background:
    | (PointReading & {
        point: Vec3;
        surfaceId: string | null;
        /** Background relative to the subject, stops (lights only). */
        stopsVsSubject: number | null;
        colour: ColourReading | null;
        /** What the camera records at this point (lights, ambient and the surface's colour). */
        recorded: RecordedTone;
        /** Brightest and darkest recorded points across the lens's horizontal field at the subject's height. */
        range: { brightest: RecordedTone & { point: Vec3 }; darkest: RecordedTone & { point: Vec3 }; samples: number } | null;
      })
    | null;
  probes: (PointReading & { id: string; point: Vec3; stopsVsSubject: number | null })[];
  ambient: {
    ev100: number;
    kelvin: number;
    luxSeconds: number;
    /** Ambient alone vs a correct exposure at the camera settings: −4.6 = "4.6 stops under". */
    stopsVsCamera: number;
  } | null;
  /** Lights plus ambient at the subject. */
  combined: { luxSeconds: number; aperture: number | null; stopsVsCamera: number | null };
  /** Stops to move every light by, together, so the lights' total reads the target; null if no light reaches. */
  allLightsStopsChange: number | null;
  warnings: MeterWarning[];
};
