// Sample widget settings for the dev preview pages (not shipped): one per calculator, each with a
// different look, in the invented firm's name. Shapes follow embedWidgetSchema.
const consent =
  'I agree that Brackenridge Ground & Damp may contact me about this request and keep my details for that purpose.';
const fields = (over = {}) => ({
  name: 'required',
  email: 'required',
  company: 'optional',
  phone: 'optional',
  message: 'optional',
  siteAddress: 'optional',
  ...over,
});
const look = (colors, font, corner, logoUrl = null) => ({ colors, font, corner, logoUrl });
const teal = { background: '#ffffff', text: '#1b2a30', primary: '#1d4e5f', primaryText: '#ffffff' };

export const samples = [
  {
    publicKey: 'wk_tuberise0000000000a',
    name: 'Brackenridge Ground & Damp · Tube rise',
    calculatorId: 'tube-rise',
    release: '0.1.0',
    settings: {
      inputs: { gravity: { mode: 'hidden' }, contactAnglePreset: { mode: 'editable' } },
      units: { system: 'si', visitorMaySwitch: true },
      look: look(teal, 'manrope', 'soft', 'LOGO'),
      cautions: 'Readings taken on site by our surveyors override any figure shown here.',
      sheet: { enabled: true, paper: 'a4' },
      leadForm: { enabled: true, fields: fields(), consentText: consent },
    },
  },
  {
    publicKey: 'wk_slotrise0000000000a',
    name: 'Mortar joint check',
    calculatorId: 'slot-rise',
    release: '0.1.0',
    settings: {
      inputs: { liquid: { mode: 'locked', default: 'water' }, gap: { mode: 'editable', default: 0.0002 } },
      units: { system: 'us', visitorMaySwitch: true },
      look: look(
        { background: '#fbf8f3', text: '#2b2118', primary: '#8a3b12', primaryText: '#ffffff' },
        'system-serif',
        'square',
      ),
      cautions: '',
      sheet: { enabled: true, paper: 'a4' },
      leadForm: {
        enabled: true,
        fields: fields({ company: 'off', phone: 'required', message: 'off' }),
        consentText: consent,
      },
    },
  },
  {
    publicKey: 'wk_soilrise0000000000a',
    name: 'Slab damp screening',
    calculatorId: 'soil-capillary-rise',
    release: '0.1.0',
    settings: {
      inputs: { hazenC: { mode: 'locked' }, d10: { mode: 'editable', default: 0.00005 } },
      units: { system: 'si', visitorMaySwitch: false },
      look: look(
        { background: '#10222b', text: '#e9f1f3', primary: '#7fd1c7', primaryText: '#0b1a1f' },
        'manrope',
        'round',
      ),
      cautions:
        'Frost-susceptible soils need a separate assessment.\nAsk us about gas membranes when a slab is replaced.',
      sheet: { enabled: true, paper: 'a4' },
      leadForm: { enabled: true, fields: fields({ siteAddress: 'required' }), consentText: consent },
    },
  },
  {
    publicKey: 'wk_pressure0000000000a',
    name: 'Interface pressure',
    calculatorId: 'interface-pressure',
    release: '0.1.0',
    settings: {
      inputs: {},
      units: { system: 'si', visitorMaySwitch: true },
      look: look(teal, 'system-sans', 'soft'),
      cautions: '',
      sheet: { enabled: true, paper: 'a4' },
      leadForm: { enabled: false, fields: fields(), consentText: consent },
    },
  },
  {
    publicKey: 'wk_wetforce0000000000a',
    name: 'Lab tensiometry',
    calculatorId: 'wetting-force',
    release: '0.1.0',
    settings: {
      inputs: { method: { mode: 'editable', default: 'ring' } },
      units: { system: 'si', visitorMaySwitch: true },
      look: look(
        { background: '#ffffff', text: '#1f1d2b', primary: '#4b3fa8', primaryText: '#ffffff' },
        'manrope',
        'round',
      ),
      cautions: '',
      sheet: { enabled: true, paper: 'a4' },
      leadForm: { enabled: true, fields: fields({ phone: 'off', siteAddress: 'off' }), consentText: consent },
    },
  },
  {
    publicKey: 'wk_wicktime0000000000a',
    name: 'Wicking time',
    calculatorId: 'wicking-time',
    release: '0.1.0',
    settings: {
      inputs: { length: { mode: 'editable', default: 0.3 } },
      units: { system: 'us', visitorMaySwitch: true },
      look: look(
        { background: '#f4f7f2', text: '#1e2a1c', primary: '#2f6b2a', primaryText: '#ffffff' },
        'manrope',
        'square',
      ),
      cautions: '',
      sheet: { enabled: true, paper: 'a4' },
      leadForm: { enabled: true, fields: fields(), consentText: consent },
    },
  },
  {
    publicKey: 'wk_angleforce00000000a',
    name: 'Coating lab · contact angle',
    calculatorId: 'contact-angle-from-force',
    release: '0.1.0',
    settings: {
      inputs: { readings: { mode: 'editable', default: 'cycle' }, gravity: { mode: 'hidden' } },
      units: { system: 'si', visitorMaySwitch: false },
      look: look(teal, 'manrope', 'soft'),
      cautions: '',
      sheet: { enabled: true, paper: 'a4' },
      leadForm: { enabled: true, fields: fields(), consentText: consent },
    },
  },
  {
    publicKey: 'wk_tensionrise0000000a',
    name: 'Surface tension from a rise',
    calculatorId: 'tension-from-rise',
    release: '0.1.0',
    settings: {
      inputs: { gravity: { mode: 'hidden' } },
      units: { system: 'us', visitorMaySwitch: true },
      look: look(
        { background: '#f7f7fb', text: '#1c1d2b', primary: '#3b3f8a', primaryText: '#ffffff' },
        'manrope',
        'round',
      ),
      cautions: '',
      sheet: { enabled: true, paper: 'a4' },
      leadForm: { enabled: false, fields: fields(), consentText: consent },
    },
  },
  {
    publicKey: 'wk_risingdamp00000000a',
    name: 'Rising damp in a solid wall',
    calculatorId: 'rising-damp-height',
    release: '0.1.0',
    settings: {
      inputs: { dryingFaces: { mode: 'locked', default: 'both' } },
      units: { system: 'si', visitorMaySwitch: true },
      look: look(
        { background: '#fbf8f4', text: '#2b2118', primary: '#7a4a24', primaryText: '#ffffff' },
        'manrope',
        'soft',
        'LOGO',
      ),
      cautions: 'We measure sorptivity and evaporation on drilled cores before advising on any treatment.',
      sheet: { enabled: true, paper: 'a4' },
      leadForm: { enabled: true, fields: fields(), consentText: consent },
    },
  },
  {
    publicKey: 'wk_frostscreen0000000a',
    name: 'Frost screening under a slab',
    calculatorId: 'frost-screening',
    release: '0.1.0',
    settings: {
      inputs: { frostDepth: { mode: 'editable', default: 1.2 } },
      units: { system: 'us', visitorMaySwitch: true },
      look: look(
        { background: '#f4f8f7', text: '#14232b', primary: '#1d4e5f', primaryText: '#ffffff' },
        'manrope',
        'round',
      ),
      cautions: 'Frost depths for the county are set by the local building department.',
      sheet: { enabled: true, paper: 'a4' },
      leadForm: { enabled: true, fields: fields(), consentText: consent },
    },
  },
];

/** A small logo drawn on a canvas, as a blob URL (no image file needed for the preview). */
export async function drawLogo() {
  const c = document.createElement('canvas');
  c.width = 240;
  c.height = 80;
  const g = c.getContext('2d');
  g.fillStyle = '#1d4e5f';
  g.fillRect(0, 0, 80, 80);
  g.fillStyle = '#ffffff';
  g.fillRect(16, 44, 48, 8);
  g.fillRect(28, 20, 8, 24);
  g.fillRect(44, 28, 8, 16);
  g.fillStyle = '#1d4e5f';
  g.font = 'bold 30px sans-serif';
  g.fillText('BG&D', 92, 52);
  const blob = await new Promise((resolve) => c.toBlob(resolve, 'image/png'));
  return URL.createObjectURL(blob);
}
