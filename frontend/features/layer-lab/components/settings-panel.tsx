import { BankCaution } from '../../../components/bank-caution';
import { LengthField, NumberField, WireField } from '../../../components/length-field';
import type { LabSettings, SettingsErrors } from '../settings';

interface Props {
  settings: LabSettings;
  errors: SettingsErrors;
  onChange: (next: LabSettings) => void;
}

/** The probe coil and sweep, and the bank and drive coil used for the launch heights. */
export function SettingsPanel({ settings: s, errors: e, onChange }: Props) {
  const sensor = (patch: Partial<LabSettings['sensor']>) =>
    onChange({ ...s, sensor: { ...s.sensor, ...patch } });
  const sweep = (patch: Partial<LabSettings['sweep']>) =>
    onChange({ ...s, sweep: { ...s.sweep, ...patch } });
  const launch = (patch: Partial<LabSettings['launch']>) =>
    onChange({ ...s, launch: { ...s.launch, ...patch } });
  const coil = (patch: Partial<LabSettings['launch']['coil']>) =>
    launch({ coil: { ...s.launch.coil, ...patch } });
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <fieldset className="flex flex-col gap-3 rounded-md border border-patina-100 bg-white p-3">
        <legend className="px-1 text-sm font-semibold">Probe coil and sweep</legend>
        <div className="flex flex-wrap gap-3">
          <LengthField
            label="Inner radius"
            entry={s.sensor.innerRadius}
            error={e['sensor.innerRadius']}
            onChange={(innerRadius) => sensor({ innerRadius })}
          />
          <LengthField
            label="Outer radius"
            entry={s.sensor.outerRadius}
            error={e['sensor.outerRadius']}
            onChange={(outerRadius) => sensor({ outerRadius })}
          />
          <LengthField
            label="Length"
            entry={s.sensor.length}
            error={e['sensor.length']}
            onChange={(length) => sensor({ length })}
          />
          <NumberField
            label="Turns"
            value={s.sensor.turns}
            error={e['sensor.turns']}
            onChange={(turns) => sensor({ turns })}
          />
          <LengthField
            label="Lift-off"
            entry={s.sensor.liftOff}
            error={e['sensor.liftOff']}
            onChange={(liftOff) => sensor({ liftOff })}
          />
        </div>
        <div className="flex flex-wrap gap-3">
          <NumberField
            label="From"
            suffix="kHz"
            value={s.sweep.fromKHz}
            error={e['sweep.fromKHz']}
            onChange={(fromKHz) => sweep({ fromKHz })}
          />
          <NumberField
            label="To"
            suffix="kHz"
            value={s.sweep.toKHz}
            error={e['sweep.toKHz']}
            onChange={(toKHz) => sweep({ toKHz })}
          />
          <NumberField
            label="Points"
            value={s.sweep.points}
            error={e['sweep.points']}
            onChange={(points) => sweep({ points })}
          />
          <NumberField
            label="Table frequency"
            suffix="kHz"
            value={s.probeKHz}
            error={e.probeKHz}
            onChange={(probeKHz) => onChange({ ...s, probeKHz })}
          />
        </div>
      </fieldset>
      <fieldset className="flex flex-col gap-3 rounded-md border border-patina-100 bg-white p-3">
        <legend className="px-1 text-sm font-semibold">Launcher for the launch heights</legend>
        <BankCaution
          compact
          capacitanceF={s.launch.capacitanceUF * 1e-6}
          voltageV={s.launch.voltageV}
        />
        <div className="flex flex-wrap gap-3">
          <NumberField
            label="Capacitance"
            suffix="µF"
            value={s.launch.capacitanceUF}
            error={e['launch.capacitanceUF']}
            onChange={(capacitanceUF) => launch({ capacitanceUF })}
          />
          <NumberField
            label="Voltage"
            suffix="V"
            value={s.launch.voltageV}
            error={e['launch.voltageV']}
            onChange={(voltageV) => launch({ voltageV })}
          />
          <NumberField
            label="Series resistance"
            suffix="Ω"
            value={s.launch.seriesResistanceOhm}
            error={e['launch.seriesResistanceOhm']}
            onChange={(seriesResistanceOhm) => launch({ seriesResistanceOhm })}
          />
          <LengthField
            label="Gap to blank"
            entry={s.launch.gap}
            error={e['launch.gap']}
            onChange={(gap) => launch({ gap })}
          />
        </div>
        <div className="flex flex-wrap gap-3">
          <LengthField
            label="Coil inner radius"
            entry={s.launch.coil.innerRadius}
            error={e['launch.coil.innerRadius']}
            onChange={(innerRadius) => coil({ innerRadius })}
          />
          <LengthField
            label="Coil outer radius"
            entry={s.launch.coil.outerRadius}
            error={e['launch.coil.outerRadius']}
            onChange={(outerRadius) => coil({ outerRadius })}
          />
          <LengthField
            label="Coil length"
            entry={s.launch.coil.length}
            error={e['launch.coil.length']}
            onChange={(length) => coil({ length })}
          />
          <NumberField
            label="Coil turns"
            value={s.launch.coil.turns}
            error={e['launch.coil.turns']}
            onChange={(turns) => coil({ turns })}
          />
          <WireField
            entry={s.launch.coil.wire}
            error={e['launch.coil.wire']}
            onChange={(wire) => coil({ wire })}
          />
        </div>
      </fieldset>
    </div>
  );
}
