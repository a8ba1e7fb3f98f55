// The site picture's controls in the map bar (place, opacity, remove) and the dialog that places one: a picture with
// its world file or a GeoTIFF (the user confirms the frame), or a plain picture pinned by two clicked points.
import { useEffect, useMemo, useState, type MouseEvent } from 'react';
import { isWhenceError } from '../../core/errors';
import { describePictureFrame, type GeodeticPosition, type PictureFrame } from '../../core/geo';
import { SITE_PICTURE_LIMITS, type SitePicture } from '../../core/project';
import { loadPictureFiles } from './loadPictureFiles';
import { guessFrame, placePicture, type PictureCandidate, type PinInput } from './placePicture';
import './sitePicture.css';

export interface SitePictureControlProps {
  picture: SitePicture | undefined;
  origin: GeodeticPosition | undefined;
  onChange: (picture: SitePicture | undefined) => void;
}

const ACCEPT = '.png,.jpg,.jpeg,.tif,.tiff,.pgw,.pngw,.jgw,.jpgw,.tfw,.wld,image/png,image/jpeg,image/tiff';

function messageOf(error: unknown): string {
  if (isWhenceError(error)) return error.message;
  return `The picture could not be read (${error instanceof Error ? error.message : String(error)}). The map is unchanged.`;
}

export function SitePictureControl({ picture, origin, onChange }: SitePictureControlProps) {
  const [open, setOpen] = useState(false);
  // The picture last removed, so Remove can be taken back (it is the only copy unless the project was saved with it).
  const [removed, setRemoved] = useState<SitePicture | undefined>(undefined);
  return (
    <span className="site-picture-control">
      {picture === undefined ? (
        <button type="button" className="small" data-testid="site-picture-open" onClick={() => setOpen(true)} title="Place a picture of the site under the map">
          Site picture…
        </button>
      ) : null}
      {picture === undefined && removed !== undefined && (
        <button type="button" className="small" data-testid="site-picture-restore" onClick={() => { onChange(removed); setRemoved(undefined); }} title={`Put ${removed.name} back under the map`}>
          Put back
        </button>
      )}
      {picture !== undefined && (
        <>
          <span className="site-picture-name" title={`${picture.name}, placed by ${picture.placedBy === 'two-points' ? 'two pinned points' : `its ${picture.placedBy === 'geotiff' ? 'GeoTIFF georeference' : 'world file'} in ${picture.frameText}`}`}>
            picture
          </span>
          <input
            type="range"
            min={0}
            max={100}
            step={5}
            value={Math.round(picture.opacity * 100)}
            aria-label="Site picture opacity"
            title={`Opacity ${Math.round(picture.opacity * 100)} %`}
            data-testid="site-picture-opacity"
            onChange={(event) => onChange({ ...picture, opacity: Number(event.target.value) / 100 })}
          />
          <button type="button" className="small" data-testid="site-picture-replace" onClick={() => setOpen(true)} title="Place another picture instead">
            Change…
          </button>
          <button type="button" className="small" data-testid="site-picture-remove" onClick={() => { setRemoved(picture); onChange(undefined); }} title="Take the picture off the map (Put back returns it)">
            Remove
          </button>
        </>
      )}
      {open && (
        <SitePictureDialog
          origin={origin}
          onCancel={() => setOpen(false)}
          onPlace={(placed) => {
            setRemoved(undefined);
            onChange(placed);
            setOpen(false);
          }}
        />
      )}
    </span>
  );
}

interface PinState {
  column?: number;
  row?: number;
  first: string;
  second: string;
}

type PinUnits = 'local' | 'degrees';

function parseNumber(text: string): number {
  const trimmed = text.trim();
  return trimmed === '' ? Number.NaN : Number(trimmed);
}

function SitePictureDialog({ origin, onCancel, onPlace }: { origin: GeodeticPosition | undefined; onCancel: () => void; onPlace: (picture: SitePicture) => void }) {
  const [candidate, setCandidate] = useState<PictureCandidate | undefined>(undefined);
  const [loading, setLoading] = useState(false);
  const [error, setError] = useState<string | undefined>(undefined);
  const [frame, setFrame] = useState<PictureFrame>({ kind: 'local' });
  const [pinMode, setPinMode] = useState(false);
  const [pins, setPins] = useState<[PinState, PinState]>([{ first: '', second: '' }, { first: '', second: '' }]);
  const [activePin, setActivePin] = useState<0 | 1>(0);
  const [units, setUnits] = useState<PinUnits>('local');

  const previewUrl = useMemo(() => (candidate === undefined ? undefined : URL.createObjectURL(new Blob([candidate.bytes as Uint8Array<ArrayBuffer>], { type: candidate.mediaType }))), [candidate]);
  useEffect(() => () => { if (previewUrl !== undefined) URL.revokeObjectURL(previewUrl); }, [previewUrl]);

  async function choose(files: File[]) {
    if (files.length === 0) return;
    setLoading(true);
    setError(undefined);
    try {
      const loaded = await loadPictureFiles(files);
      setCandidate(loaded);
      const georeference = loaded.georeference;
      setPinMode(georeference === undefined);
      setPins([{ first: '', second: '' }, { first: '', second: '' }]);
      setActivePin(0);
      if (georeference?.kind === 'world-file' || (georeference?.kind === 'geotiff' && georeference.frame === undefined)) setFrame(guessFrame(georeference.affine, origin));
    } catch (caught) {
      setCandidate(undefined);
      setError(messageOf(caught));
    } finally {
      setLoading(false);
    }
  }

  function pinAt(event: MouseEvent<HTMLImageElement>) {
    if (candidate === undefined) return;
    const box = event.currentTarget.getBoundingClientRect();
    // The shown picture is scaled; a click at u (0 at the left edge) is column u − ½ of the pixel-centre grid.
    const column = ((event.clientX - box.left) / box.width) * candidate.widthPixels - 0.5;
    const row = ((event.clientY - box.top) / box.height) * candidate.heightPixels - 0.5;
    setPins((current) => {
      const next: [PinState, PinState] = [{ ...current[0] }, { ...current[1] }];
      next[activePin] = { ...next[activePin], column, row };
      return next;
    });
    setActivePin((current) => (current === 0 ? 1 : current));
  }

  function place() {
    if (candidate === undefined) return;
    setError(undefined);
    try {
      if (pinMode) {
        const inputs = pins.map((pin, index) => {
          if (pin.column === undefined || pin.row === undefined) throw new Error(`Click point ${index + 1} on the picture first.`);
          const a = parseNumber(pin.first);
          const b = parseNumber(pin.second);
          if (!Number.isFinite(a) || !Number.isFinite(b)) throw new Error(`Give point ${index + 1} its ${units === 'local' ? 'east and north in metres' : 'latitude and longitude in decimal degrees'} (numbers with a decimal point).`);
          return units === 'local' ? { column: pin.column, row: pin.row, eastMeters: a, northMeters: b } : { column: pin.column, row: pin.row, latitudeDegrees: a, longitudeDegrees: b };
        }) as [PinInput, PinInput];
        onPlace(placePicture(candidate, { pins: inputs }, origin));
      } else {
        onPlace(placePicture(candidate, { frame }, origin));
      }
    } catch (caught) {
      setError(isWhenceError(caught) || !(caught instanceof Error) ? messageOf(caught) : caught.message);
    }
  }

  const georeference = candidate?.georeference;
  const fixedFrame = georeference?.kind === 'geotiff' ? georeference.frame : undefined;
  return (
    <div className="site-picture-backdrop" role="presentation" onPointerDown={(event) => event.stopPropagation()}>
      <div className="site-picture-dialog" role="dialog" aria-modal="true" aria-labelledby="site-picture-title" data-testid="site-picture-dialog">
        <h2 id="site-picture-title">Place a picture of the site under the map</h2>
        <p className="muted">
          A PNG or JPEG with its world file (.pgw, .jgw, .wld), a GeoTIFF, or a plain picture you pin by two points whose ground positions you know.
          Select the picture and its world file together. At most {SITE_PICTURE_LIMITS.maxBytes / 2 ** 20} MiB and {SITE_PICTURE_LIMITS.maxSidePixels} pixels a side; the project keeps a copy.
        </p>
        <input type="file" multiple accept={ACCEPT} data-testid="site-picture-files" onChange={(event) => void choose(Array.from(event.target.files ?? []))} />
        {loading && <p className="muted">Reading the picture…</p>}
        {candidate !== undefined && (
          <p data-testid="site-picture-summary">
            <strong>{candidate.name}</strong>, {candidate.widthPixels} × {candidate.heightPixels} pixels
            {georeference?.kind === 'world-file' && <>, world file {georeference.fileName}</>}
            {georeference?.kind === 'geotiff' && <>, GeoTIFF in {georeference.crsText}</>}
            {georeference === undefined && <>, no world file: pin it by two points below, or choose its world file too.</>}
          </p>
        )}
        {candidate !== undefined && georeference !== undefined && !pinMode && (
          <div className="site-picture-frame">
            {fixedFrame !== undefined ? (
              <p>Its coordinates are in {describePictureFrame(fixedFrame)}.</p>
            ) : (
              <label>
                Its coordinates are in{' '}
                <select data-testid="site-picture-frame" value={frame.kind} onChange={(event) => setFrame(event.target.value === 'utm' ? { kind: 'utm', zone: frame.kind === 'utm' ? frame.zone : 33, hemisphere: frame.kind === 'utm' ? frame.hemisphere : 'north' } : { kind: event.target.value as 'local' | 'wgs84' })}>
                  <option value="local">local metres (the array’s own east/north)</option>
                  <option value="wgs84">WGS84 longitude/latitude degrees (EPSG:4326)</option>
                  <option value="utm">UTM metres, WGS84 (EPSG:326zz/327zz)</option>
                </select>
                {frame.kind === 'utm' && (
                  <>
                    {' '}zone{' '}
                    <input type="number" min={1} max={60} value={frame.zone} data-testid="site-picture-utm-zone" className="site-picture-zone" onChange={(event) => setFrame({ ...frame, zone: Number(event.target.value) })} />
                    <select value={frame.hemisphere} data-testid="site-picture-utm-hemisphere" onChange={(event) => setFrame({ ...frame, hemisphere: event.target.value as 'north' | 'south' })}>
                      <option value="north">north</option>
                      <option value="south">south</option>
                    </select>
                  </>
                )}
              </label>
            )}
            <button type="button" className="link" data-testid="site-picture-pin-instead" onClick={() => setPinMode(true)}>or pin it by two points instead</button>
          </div>
        )}
        {candidate !== undefined && pinMode && previewUrl !== undefined && (
          <div className="site-picture-pins">
            <p className="muted">Click point {activePin + 1} on the picture, then give each point its ground position.</p>
            <div className="site-picture-preview">
              <img src={previewUrl} alt={`The picture ${candidate.name}`} data-testid="site-picture-preview" onClick={pinAt} draggable={false} />
              {pins.map((pin, index) =>
                pin.column === undefined || pin.row === undefined ? null : (
                  <span key={index} className="site-picture-pin" style={{ left: `${((pin.column + 0.5) / candidate.widthPixels) * 100}%`, top: `${((pin.row + 0.5) / candidate.heightPixels) * 100}%` }}>
                    {index + 1}
                  </span>
                ),
              )}
            </div>
            <label>
              Ground positions in{' '}
              <select value={units} data-testid="site-picture-pin-units" onChange={(event) => setUnits(event.target.value as PinUnits)}>
                <option value="local">local metres (east, north)</option>
                <option value="degrees">WGS84 degrees (latitude, longitude)</option>
              </select>
            </label>
            {pins.map((pin, index) => (
              <div key={index} className={`site-picture-pin-row${activePin === index ? ' active' : ''}`}>
                <button type="button" className="small" onClick={() => setActivePin(index as 0 | 1)} aria-pressed={activePin === index}>Point {index + 1}</button>
                <span className="muted" data-testid={`site-picture-pin-${index + 1}-pixel`}>{pin.column === undefined || pin.row === undefined ? 'not clicked yet' : `pixel ${pin.column.toFixed(1)}, ${pin.row.toFixed(1)}`}</span>
                <input aria-label={`Point ${index + 1} ${units === 'local' ? 'east, m' : 'latitude, °'}`} placeholder={units === 'local' ? 'east m' : 'latitude °'} value={pin.first} data-testid={`site-picture-pin-${index + 1}-first`} onChange={(event) => setPins((current) => { const next: [PinState, PinState] = [{ ...current[0] }, { ...current[1] }]; next[index] = { ...next[index]!, first: event.target.value }; return next; })} />
                <input aria-label={`Point ${index + 1} ${units === 'local' ? 'north, m' : 'longitude, °'}`} placeholder={units === 'local' ? 'north m' : 'longitude °'} value={pin.second} data-testid={`site-picture-pin-${index + 1}-second`} onChange={(event) => setPins((current) => { const next: [PinState, PinState] = [{ ...current[0] }, { ...current[1] }]; next[index] = { ...next[index]!, second: event.target.value }; return next; })} />
              </div>
            ))}
          </div>
        )}
        {error !== undefined && <p className="site-picture-error" role="alert" data-testid="site-picture-error">{error}</p>}
        <div className="site-picture-actions">
          <button type="button" onClick={onCancel} data-testid="site-picture-cancel">Cancel</button>
          <button type="button" className="primary" disabled={candidate === undefined} onClick={place} data-testid="site-picture-place">Place on the map</button>
        </div>
      </div>
    </div>
  );
}
