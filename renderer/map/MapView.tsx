// The map view: array, pair hyperbolae, fixes with their uncertainty ellipses and an optional SRP or precision raster,
// with a metric grid, scale bar and north arrow; wheel/keyboard zoom, drag to pan, draggable microphones when editable.
// Controls sit in a bar above the canvas and the legend in a strip below it, so nothing covers the map's content.
// Units: local east/north metres in the props, pixels only here and through the one MapScale.

import type Konva from 'konva';
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState, type ComponentProps, type KeyboardEvent } from 'react';
import { Circle, Group, Image as KonvaImage, Layer, Line, Rect, RegularPolygon, Stage, Text } from 'react-konva';
import { WhenceError } from '../../core/errors';
import type { LabelBox } from './curveLabels';
import { fixShapes, type FixShape } from './fixShapes';
import { mapGrid } from './gridLines';
import { hyperbolaShapes } from './hyperbolaShapes';
import { MapCursorReadout, type CursorSink } from './MapCursorReadout';
import { edgeDistanceText, edgeMarkers, frameArrayAndFixes, scaleShowing } from './mapFraming';
import { MapLegend } from './MapLegend';
import { MapNorthArrow } from './MapNorthArrow';
import { MapScale, type MapBounds } from './mapScale';
import { MapScaleBar } from './MapScaleBar';
import { SitePictureImage } from './SitePictureImage';
import { sitePictureCorners } from './sitePictureTransform';
import { microphoneMarkers } from './microphoneMarkers';
import { overlayRaster, type OverlayRaster } from './overlayRaster';
import type { MapViewProps } from './types';
import { useElementSize } from './useElementSize';
import { verdictLabel, type VerdictMarker } from '../verdict';
import './mapView.css';

/** One wheel notch (100 px of deltaY) zooms by about 1.2×. */
const wheelZoomPerPixel = 0.0018;
const keyZoomFactor = 1.25;
const keyPanFraction = 0.1;
/** A press that moves less than this is a click, not a pan. */
const clickSlopPixels = 4;
const micRadiusPixels = 6.5;
const emptyBounds: MapBounds = { minEastMeters: -50, maxEastMeters: 50, minNorthMeters: -50, maxNorthMeters: 50 };

/** Where edge markers sit along the canvas border: curve labels keep clear of that band. */
function edgeBand(scale: MapScale): LabelBox[] {
  const w = scale.widthPixels;
  const h = scale.heightPixels;
  const band = 34;
  return [
    { xPixels: 0, yPixels: 0, widthPixels: w, heightPixels: band / 2 },
    { xPixels: 0, yPixels: h - band / 2, widthPixels: w, heightPixels: band / 2 },
  ];
}

function fitPadding(widthPixels: number, heightPixels: number): number {
  return Math.max(36, Math.round(0.08 * Math.min(widthPixels, heightPixels)));
}

function rasterCanvas(raster: OverlayRaster): HTMLCanvasElement | null {
  const canvas = document.createElement('canvas');
  canvas.width = raster.width;
  canvas.height = raster.height;
  const context = canvas.getContext('2d');
  if (context === null) return null;
  context.putImageData(new ImageData(raster.data, raster.width, raster.height), 0, 0);
  return canvas;
}

export function MapView(props: MapViewProps) {
  const { microphones, hyperbolae, speedMetersPerSecond, planeUpMeters, fixes, overlay, origin, editable, controls, sitePicture } = props;
  const containerRef = useRef<HTMLDivElement>(null);
  const canvasRef = useRef<HTMLDivElement>(null);
  const size = useElementSize(canvasRef);
  const [scale, setScale] = useState<MapScale | null>(null);
  const [hoveredFixId, setHoveredFixId] = useState<string | null>(null);
  const [hoveredMicrophone, setHoveredMicrophone] = useState<number | null>(null);
  const [draggedMicrophone, setDraggedMicrophone] = useState<number | null>(null);
  const [panning, setPanning] = useState(false);
  const [hoverCursor, setHoverCursor] = useState<'grab' | 'grabbing' | 'pointer' | null>(null);

  // Latest values for handlers that outlive a render (window listeners, animation frames).
  const latest = useRef({ scale, props });
  useLayoutEffect(() => {
    latest.current = { scale, props };
  });

  const fitted = useRef(false);
  const fitScale = useCallback((widthPixels: number, heightPixels: number): MapScale => {
    const { microphones: mics, fixes: fx } = latest.current.props;
    const { bounds } = frameArrayAndFixes(mics, fx);
    return MapScale.fit(bounds ?? emptyBounds, widthPixels, heightPixels, fitPadding(widthPixels, heightPixels));
  }, []);

  // Fit when there is a size and something to show, again on a resize or when the first fixes arrive, until the user
  // zooms or pans (`fitted` then holds the view: a resize keeps its centre and zoom).
  const hasContent = microphones.length + fixes.length > 0;
  const hasFixes = fixes.length > 0;
  useLayoutEffect(() => {
    if (size === null) return;
    setScale((previous) => {
      if (previous !== null && (fitted.current || !hasContent)) return previous.resized(size.widthPixels, size.heightPixels);
      return fitScale(size.widthPixels, size.heightPixels);
    });
  }, [size, hasContent, hasFixes, fitScale]);

  const fitView = useCallback(() => {
    if (size === null) return;
    fitted.current = false;
    setScale(fitScale(size.widthPixels, size.heightPixels));
  }, [size, fitScale]);

  // A newly selected fix is brought into view (panned to, the zoom kept) when it lies outside the canvas.
  const selectedFix = fixes.find((fix) => fix.selected);
  const selectedKey = selectedFix === undefined ? '' : selectedFix.id;
  useEffect(() => {
    const chosen = latest.current.props.fixes.find((fix) => fix.selected);
    if (chosen === undefined) return;
    setScale((previous) => (previous === null ? previous : scaleShowing(previous, chosen)));
  }, [selectedKey]);

  // View-models: each recomputed only when its own inputs change.
  const grid = useMemo(() => (scale ? mapGrid(scale) : null), [scale]);
  const curves = useMemo(
    () => (scale ? hyperbolaShapes(microphones, hyperbolae, speedMetersPerSecond, planeUpMeters, scale, { labelAvoid: edgeBand(scale) }) : []),
    [microphones, hyperbolae, speedMetersPerSecond, planeUpMeters, scale],
  );
  const markers = useMemo(() => (scale ? microphoneMarkers(microphones, scale) : []), [microphones, scale]);
  const fixList = useMemo(() => (scale ? fixShapes(fixes, scale) : []), [fixes, scale]);
  const offView = useMemo(() => (scale ? edgeMarkers(scale, fixes) : []), [fixes, scale]);
  const rasterResult = useMemo((): { raster: OverlayRaster | null; error: string | null } => {
    if (overlay === undefined) return { raster: null, error: null };
    try {
      return { raster: overlayRaster(overlay), error: null };
    } catch (error) {
      if (error instanceof WhenceError) return { raster: null, error: error.message };
      throw error;
    }
  }, [overlay]);
  const overlayImage = useMemo(() => (rasterResult.raster ? rasterCanvas(rasterResult.raster) : null), [rasterResult]);
  const overlayRect = scale && rasterResult.raster ? scale.toScreenRect(rasterResult.raster.bounds) : null;
  const peakPoint = scale && rasterResult.raster && overlay?.peak !== undefined ? { xPixels: scale.xPixels(overlay.peak.eastMeters), yPixels: scale.yPixels(overlay.peak.northMeters) } : null;

  // Cursor readout, fed without re-rendering the map.
  const cursorSink = useRef<CursorSink | null>(null);
  const stageRef = useRef<Konva.Stage>(null);
  const reportPointer = useCallback(() => {
    const position = stageRef.current?.getPointerPosition();
    cursorSink.current?.(position ? { xPixels: position.x, yPixels: position.y } : null);
  }, []);

  // Wheel zoom about the cursor.
  const onWheel = useCallback((event: Konva.KonvaEventObject<WheelEvent>) => {
    event.evt.preventDefault();
    const position = stageRef.current?.getPointerPosition();
    if (!position) return;
    const deltaPixels = event.evt.deltaY * (event.evt.deltaMode === 1 ? 16 : event.evt.deltaMode === 2 ? 400 : 1);
    const factor = Math.exp(-deltaPixels * wheelZoomPerPixel);
    fitted.current = true;
    setScale((previous) => previous?.zoomedAbout(factor, { xPixels: position.x, yPixels: position.y }) ?? previous);
  }, []);

  // Drag on the background (or on a fix) to pan; updates are gathered per animation frame.
  const panCleanup = useRef<(() => void) | null>(null);
  const pressTravel = useRef(0);
  const onPointerDown = useCallback((event: Konva.KonvaEventObject<PointerEvent>) => {
    if (event.evt.button !== 0 || (latest.current.props.editable && event.target.hasName('microphone-handle'))) return;
    containerRef.current?.focus({ preventScroll: true });
    panCleanup.current?.();
    pressTravel.current = 0;
    let lastX = event.evt.clientX;
    let lastY = event.evt.clientY;
    let pendingX = 0;
    let pendingY = 0;
    let frame = 0;
    const flush = (): void => {
      frame = 0;
      const dx = pendingX;
      const dy = pendingY;
      pendingX = 0;
      pendingY = 0;
      if (dx !== 0 || dy !== 0) setScale((previous) => previous?.panned(dx, dy) ?? previous);
    };
    const move = (moveEvent: PointerEvent): void => {
      const dx = moveEvent.clientX - lastX;
      const dy = moveEvent.clientY - lastY;
      lastX = moveEvent.clientX;
      lastY = moveEvent.clientY;
      pressTravel.current += Math.hypot(dx, dy);
      if (pressTravel.current < clickSlopPixels) return;
      if (!fitted.current) fitted.current = true;
      setPanning(true);
      pendingX += dx;
      pendingY += dy;
      if (frame === 0) frame = requestAnimationFrame(flush);
    };
    const end = (): void => {
      window.removeEventListener('pointermove', move);
      window.removeEventListener('pointerup', end);
      window.removeEventListener('pointercancel', end);
      if (frame !== 0) {
        cancelAnimationFrame(frame);
        flush();
      }
      setPanning(false);
      panCleanup.current = null;
    };
    window.addEventListener('pointermove', move);
    window.addEventListener('pointerup', end);
    window.addEventListener('pointercancel', end);
    panCleanup.current = end;
  }, []);
  useEffect(() => () => panCleanup.current?.(), []);

  // Dragging a microphone: report its new place once per animation frame, and once more on release.
  const dragPending = useRef<{ index: number; xPixels: number; yPixels: number } | null>(null);
  const dragFrame = useRef(0);
  const reportMicrophone = useCallback(() => {
    dragFrame.current = 0;
    const pending = dragPending.current;
    dragPending.current = null;
    const { scale: current, props: currentProps } = latest.current;
    if (pending === null || current === null) return;
    currentProps.onMoveMicrophone?.(pending.index, current.eastMeters(pending.xPixels), current.northMeters(pending.yPixels));
  }, []);
  // Leading edge: the first move of a frame is reported at once; later moves in that frame are merged into one
  // report when the frame begins.
  const onMicrophoneDragMove = useCallback(
    (index: number, node: Konva.Node) => {
      dragPending.current = { index, xPixels: node.x(), yPixels: node.y() };
      reportPointer(); // the stage sees no pointer moves while Konva drags
      if (dragFrame.current !== 0) return;
      reportMicrophone();
      dragFrame.current = requestAnimationFrame(reportMicrophone);
    },
    [reportMicrophone, reportPointer],
  );
  const onMicrophoneDragEnd = useCallback(
    (index: number, node: Konva.Node) => {
      if (dragFrame.current !== 0) cancelAnimationFrame(dragFrame.current);
      dragPending.current = { index, xPixels: node.x(), yPixels: node.y() };
      reportMicrophone();
      setHoverCursor(null);
      setDraggedMicrophone(null);
      // Back to where the props put it: if the parent accepted the move, the next render moves it there.
      const { scale: current, props: currentProps } = latest.current;
      const mic = currentProps.microphones[index];
      if (current !== null && mic !== undefined) node.position({ x: current.xPixels(mic.eastMeters), y: current.yPixels(mic.northMeters) });
    },
    [reportMicrophone],
  );
  useEffect(
    () => () => {
      if (dragFrame.current !== 0) cancelAnimationFrame(dragFrame.current);
    },
    [],
  );

  const selectFix = useCallback((id: string) => {
    if (pressTravel.current >= clickSlopPixels) return;
    latest.current.props.onSelectFix?.(id);
  }, []);

  const onKeyDown = useCallback(
    (event: KeyboardEvent<HTMLDivElement>) => {
      if (event.altKey || event.ctrlKey || event.metaKey) return;
      const step = (scale?.widthPixels ?? 0) * keyPanFraction;
      const stepY = (scale?.heightPixels ?? 0) * keyPanFraction;
      let change: ((s: MapScale) => MapScale) | null = null;
      switch (event.key) {
        case '+':
        case '=':
          change = (s) => s.zoomed(keyZoomFactor);
          break;
        case '-':
        case '_':
          change = (s) => s.zoomed(1 / keyZoomFactor);
          break;
        case 'ArrowLeft':
          change = (s) => s.panned(step, 0);
          break;
        case 'ArrowRight':
          change = (s) => s.panned(-step, 0);
          break;
        case 'ArrowUp':
          change = (s) => s.panned(0, stepY);
          break;
        case 'ArrowDown':
          change = (s) => s.panned(0, -stepY);
          break;
        case 'f':
        case '0':
          event.preventDefault();
          fitView();
          return;
        default:
          return;
      }
      event.preventDefault();
      fitted.current = true;
      const apply = change;
      setScale((previous) => (previous ? apply(previous) : previous));
    },
    [scale, fitView],
  );

  const hoveredFix = fixList.find((fix) => fix.id === hoveredFixId) ?? null;
  const shownIndex = draggedMicrophone ?? hoveredMicrophone;
  const shownMicrophone = markers.find((marker) => marker.index === shownIndex) ?? null;
  const cursor = panning ? 'grabbing' : (hoverCursor ?? 'crosshair');
  const width = size?.widthPixels ?? 0;
  const height = size?.heightPixels ?? 0;

  return (
    <div
      className="map-view"
      data-testid="map-view"
      ref={containerRef}
      tabIndex={0}
      role="application"
      aria-label="Map of the array and fixes. Plus and minus zoom, arrow keys pan, F fits the view."
      onKeyDown={onKeyDown}
      data-meters-per-pixel={scale?.metersPerPixel}
      data-center-east-meters={scale?.centerEastMeters}
      data-center-north-meters={scale?.centerNorthMeters}
      style={{ cursor }}
    >
      <div className="map-bar">
        <div className="map-bar-controls">{controls}</div>
        {scale !== null && (
          <div className="map-footer">
            <MapScaleBar metersPerPixel={scale.metersPerPixel} />
            <MapCursorReadout sinkRef={cursorSink} scale={scale} origin={origin} planeUpMeters={planeUpMeters} />
          </div>
        )}
        <div className="map-toolbar">
          <button type="button" onClick={() => { fitted.current = true; setScale((s) => s?.zoomed(keyZoomFactor) ?? s); }} aria-label="Zoom in" title="Zoom in (+)">
            +
          </button>
          <button type="button" onClick={() => { fitted.current = true; setScale((s) => s?.zoomed(1 / keyZoomFactor) ?? s); }} aria-label="Zoom out" title="Zoom out (−)">
            −
          </button>
          <button type="button" data-testid="map-fit" onClick={fitView} title="Fit the array and the fixes near it (F); far fixes are marked on the edge">
            Fit
          </button>
        </div>
        <div className="map-north">
          <MapNorthArrow sizePixels={28} />
        </div>
      </div>
      <div className="map-canvas" ref={canvasRef}>
      <div className="map-stage" data-testid="map-stage">
        {scale !== null && width > 0 && height > 0 && (
          <Stage
            ref={stageRef}
            width={width}
            height={height}
            onWheel={onWheel}
            onPointerDown={onPointerDown}
            onPointerMove={reportPointer}
            onPointerLeave={() => cursorSink.current?.(null)}
          >
            <Layer listening={false}>
              <Rect x={0} y={0} width={width} height={height} fill="#fbf9f4" />
              {sitePicture !== undefined && <SitePictureImage picture={sitePicture} scale={scale} />}
              {overlayImage && overlayRect && (
                <KonvaImage
                  image={overlayImage}
                  x={overlayRect.xPixels}
                  y={overlayRect.yPixels}
                  width={overlayRect.widthPixels}
                  height={overlayRect.heightPixels}
                />
              )}
              {overlayRect && (
                <Rect
                  x={overlayRect.xPixels}
                  y={overlayRect.yPixels}
                  width={overlayRect.widthPixels}
                  height={overlayRect.heightPixels}
                  stroke="#8662b0"
                  strokeWidth={1}
                  dash={[2, 4]}
                  opacity={0.6}
                />
              )}
              {grid?.eastLines.map((line) => (
                <Line
                  key={`e${line.valueMeters}`}
                  points={[line.positionPixels, 0, line.positionPixels, height]}
                  stroke={line.isOrigin ? '#a89f8c' : '#ddd6c8'}
                  strokeWidth={1}
                />
              ))}
              {grid?.northLines.map((line) => (
                <Line
                  key={`n${line.valueMeters}`}
                  points={[0, line.positionPixels, width, line.positionPixels]}
                  stroke={line.isOrigin ? '#a89f8c' : '#ddd6c8'}
                  strokeWidth={1}
                />
              ))}
            </Layer>
            <Layer listening={false}>
              {curves.map((curve) =>
                curve.polylinesPixels.map((points, k) =>
                  points.length === 2 ? (
                    <Circle key={`${curve.key}/${k}`} x={points[0]} y={points[1]} radius={2.5} fill={curve.colour} />
                  ) : (
                    <Line
                      key={`${curve.key}/${k}`}
                      points={points}
                      stroke={curve.colour}
                      strokeWidth={curve.strokePixels}
                      lineCap="round"
                      lineJoin="round"
                      perfectDrawEnabled={false}
                    />
                  ),
                ),
              )}
            </Layer>
            <Layer>
              {fixList.map((fix) => (
                <FixMark
                  key={fix.id}
                  fix={fix}
                  hovered={fix.id === hoveredFixId}
                  onEnter={() => {
                    setHoveredFixId(fix.id);
                    setHoverCursor('pointer');
                  }}
                  onLeave={() => {
                    setHoveredFixId((current) => (current === fix.id ? null : current));
                    setHoverCursor(null);
                  }}
                  onSelect={() => selectFix(fix.id)}
                />
              ))}
              {markers.map((marker) => (
                <Group
                  key={marker.index}
                  x={marker.xPixels}
                  y={marker.yPixels}
                  draggable={editable}
                  onDragStart={() => {
                    setHoverCursor('grabbing');
                    setDraggedMicrophone(marker.index);
                  }}
                  onDragMove={(event) => onMicrophoneDragMove(marker.index, event.target)}
                  onDragEnd={(event) => onMicrophoneDragEnd(marker.index, event.target)}
                  onMouseEnter={() => {
                    setHoverCursor(editable ? 'grab' : null);
                    setHoveredMicrophone(marker.index);
                  }}
                  onMouseLeave={() => {
                    setHoverCursor((current) => (current === 'grabbing' ? current : null));
                    setHoveredMicrophone((current) => (current === marker.index ? null : current));
                  }}
                >
                  <Circle name="microphone-handle" radius={editable ? 11 : micRadiusPixels} fill="rgba(47,111,98,0.001)" />
                  <Circle
                    name="microphone-handle"
                    radius={micRadiusPixels}
                    fill="#2f6f62"
                    stroke="#fffdf8"
                    strokeWidth={2}
                    shadowColor="#1d2a2f"
                    shadowBlur={3}
                    shadowOpacity={0.35}
                  />
                  <HaloText
                    name="microphone-handle"
                    x={micRadiusPixels + 3}
                    y={-micRadiusPixels - 13}
                    text={marker.label}
                    fontSize={12}
                    fontStyle="bold"
                    fill="#1d2a2f"
                  />
                </Group>
              ))}
            </Layer>
            <Layer listening={false}>
              {curves.map((curve) =>
                curve.label === undefined ? null : (
                  <HaloText
                    key={`label/${curve.key}`}
                    x={curve.label.xPixels}
                    y={curve.label.yPixels}
                    text={curve.pairLabel}
                    fontSize={11}
                    fill={curve.colour}
                  />
                ),
              )}
              {grid?.eastLines.map((line) => (
                <HaloText
                  key={`le${line.valueMeters}`}
                  x={line.positionPixels + 3}
                  y={4}
                  text={line.label}
                  fontSize={11}
                  fill="#5d6b70"
                />
              ))}
              {grid?.northLines.map((line) => (
                <HaloText
                  key={`ln${line.valueMeters}`}
                  x={4}
                  y={line.positionPixels - 14}
                  text={line.label}
                  fontSize={11}
                  fill="#5d6b70"
                />
              ))}
            </Layer>
            <Layer>
              {offView.map((marker) => (
                <Group key={`edge/${marker.ids[0]}`} x={marker.xPixels} y={marker.yPixels} onClick={() => selectFix(marker.ids[0]!)} onTap={() => selectFix(marker.ids[0]!)}
                  onMouseEnter={() => setHoverCursor('pointer')} onMouseLeave={() => setHoverCursor(null)}>
                  <Circle radius={12} fill="rgba(255,253,248,0.92)" stroke="#5d6b70" strokeWidth={1} />
                  <Line points={[9, 0, -6, -6.5, -2.5, 0, -6, 6.5]} closed rotation={marker.rotationDegrees} fill={selectedFix !== undefined && marker.ids.includes(selectedFix.id) ? '#d1432f' : '#1d2a2f'} />
                  {marker.text !== undefined && <HaloText x={marker.text.xPixels} y={marker.text.yPixels} text={marker.text.value} fontSize={11} fill="#1d2a2f" />}
                </Group>
              ))}
              {peakPoint !== null && (
                <Group x={peakPoint.xPixels} y={peakPoint.yPixels} listening={false}>
                  <RegularPolygon sides={4} radius={8} stroke="#fffdf8" strokeWidth={4} />
                  <RegularPolygon sides={4} radius={8} stroke="#6a3d9a" strokeWidth={2} />
                  <HaloText x={10} y={-16} text="SRP peak" fontSize={11} fill="#6a3d9a" />
                </Group>
              )}
            </Layer>
          </Stage>
        )}
      </div>
      {hoveredFix !== null && (
        <div className="map-tooltip" data-testid="map-fix-tooltip" style={{ left: hoveredFix.xPixels + 14, top: hoveredFix.yPixels + 14 }}>
          <strong>{hoveredFix.label}</strong> <span className={`map-status map-status-${hoveredFix.status}`}>{hoveredFix.status}</span>
          {hoveredFix.verdict !== undefined && <div data-testid="map-fix-tooltip-verdict"><strong style={{ color: hoveredFix.colour }}>{verdictLabel(hoveredFix.verdict)}</strong>{hoveredFix.verdictReason !== undefined ? `: ${hoveredFix.verdictReason}` : ''}</div>}
          {hoveredFix.ellipseLabel !== undefined && <div>{hoveredFix.ellipseLabel}</div>}
          {hoveredFix.alternative !== undefined && <div>other solution marked ○</div>}
          <div className="muted">click to select</div>
        </div>
      )}

      {shownMicrophone !== null && hoveredFix === null && (
        <div className="map-tooltip" data-testid="map-microphone-tooltip" style={{ left: shownMicrophone.xPixels + 14, top: shownMicrophone.yPixels + 14 }}>
          {shownMicrophone.title}
          {editable && draggedMicrophone === null && <div className="muted">drag to move</div>}
        </div>
      )}
      </div>
      <div className="map-foot">
        <MapLegend showHyperbolae={hyperbolae.length > 0} showFixes={fixList.length > 0} overlay={rasterResult.raster?.legend ?? null} overlayError={rasterResult.error} srpPeak={peakPoint !== null} />
      </div>

      <ul className="map-probe" aria-hidden="true">
        {sitePicture !== undefined && scale !== null && (
          <li data-testid="map-site-picture" data-opacity={sitePicture.opacity} data-corners-pixels={JSON.stringify(sitePictureCorners(sitePicture.affine, sitePicture.widthPixels, sitePicture.heightPixels, scale).map((p) => [p.xPixels, p.yPixels]))}>
            site picture
          </li>
        )}
        {markers.map((marker) => (
          <li
            key={marker.index}
            data-testid={`map-microphone-${marker.index}`}
            data-label={marker.label}
            data-channel={marker.channel}
            data-x-pixels={marker.xPixels}
            data-y-pixels={marker.yPixels}
            data-east-meters={microphones[marker.index]?.eastMeters}
            data-north-meters={microphones[marker.index]?.northMeters}
          >
            {marker.title}
          </li>
        ))}
        {offView.map((marker) => (
          <li key={`edge/${marker.ids[0]}`} data-testid={`map-edge-marker-${marker.ids[0]}`} data-ids={marker.ids.join(' ')} data-x-pixels={marker.xPixels} data-y-pixels={marker.yPixels} data-distance-meters={marker.distanceMeters}>
            {marker.label} off the view, {edgeDistanceText(marker.distanceMeters)} from its centre
          </li>
        ))}
        {peakPoint !== null && overlay?.peak !== undefined && (
          <li data-testid="map-srp-peak" data-east-meters={overlay.peak.eastMeters} data-north-meters={overlay.peak.northMeters} data-x-pixels={peakPoint.xPixels} data-y-pixels={peakPoint.yPixels}>SRP peak</li>
        )}
        {fixList.map((fix) => (
          <li
            key={fix.id}
            data-testid={`map-fix-${fix.id}`}
            data-status={fix.status}
            data-verdict={fix.verdict}
            data-marker={fix.marker}
            data-colour={fix.colour}
            data-selected={fix.selected}
            data-x-pixels={fix.xPixels}
            data-y-pixels={fix.yPixels}
            data-alternative-x-pixels={fix.alternative?.xPixels}
            data-alternative-y-pixels={fix.alternative?.yPixels}
          >
            {fix.title}
          </li>
        ))}
        {curves.map((curve) => (
          <li key={curve.key} data-testid={`map-hyperbola-${curve.indexA}-${curve.indexB}`} data-polylines={curve.polylinesPixels.length} data-colour={curve.colour}>
            {curve.pairLabel}
            {curve.note !== undefined ? `: ${curve.note}` : ''}
          </li>
        ))}
      </ul>
    </div>
  );
}

interface FixMarkProps {
  fix: FixShape;
  hovered: boolean;
  onEnter: () => void;
  onLeave: () => void;
  onSelect: () => void;
}

/** One fix: ellipse, centre cross, label and, when ambiguous, a dashed link to the other solution. */
function FixMark({ fix, hovered, onEnter, onLeave, onSelect }: FixMarkProps) {
  const emphasis = fix.selected || hovered ? 1.5 : 0;
  const arm = 7 + emphasis * 1.5;
  return (
    <Group onMouseEnter={onEnter} onMouseLeave={onLeave} onClick={onSelect} onTap={onSelect}>
      {fix.ellipsePixels !== undefined && (
        <Line
          points={fix.ellipsePixels}
          closed
          stroke={fix.colour}
          strokeWidth={1.5 + emphasis}
          fill={fix.selected ? 'rgba(209,67,47,0.12)' : 'rgba(29,42,47,0.08)'}
          perfectDrawEnabled={false}
        />
      )}
      {fix.alternative !== undefined && (
        <>
          <Line
            points={[fix.xPixels, fix.yPixels, fix.alternative.xPixels, fix.alternative.yPixels]}
            stroke={fix.colour}
            strokeWidth={1}
            dash={[5, 4]}
            opacity={0.8}
          />
          <Circle x={fix.alternative.xPixels} y={fix.alternative.yPixels} radius={6 + emphasis} stroke={fix.colour} strokeWidth={2} fill="rgba(255,253,248,0.85)" />
          <Text x={fix.alternative.xPixels + 9} y={fix.alternative.yPixels + 4} text={`${fix.label}?`} fontSize={11} fill={fix.colour} />
        </>
      )}
      <Circle x={fix.xPixels} y={fix.yPixels} radius={12} fill="rgba(0,0,0,0.001)" />
      <FixMarker marker={fix.marker} x={fix.xPixels} y={fix.yPixels} arm={arm} colour={fix.colour} widthPixels={2 + emphasis} />
      <HaloText
        x={fix.xPixels + 10}
        y={fix.yPixels - 20}
        text={fix.text}
        fontSize={12}
        fontStyle={fix.selected ? 'bold' : 'normal'}
        fill={fix.colour}
      />
    </Group>
  );
}

interface FixMarkerProps {
  marker: VerdictMarker;
  x: number;
  y: number;
  arm: number;
  colour: string;
  widthPixels: number;
}

/** The verdict's marker on a light halo: a plus (firm), a triangle with a centre dot (doubtful), a diagonal cross (unusable). */
function FixMarker({ marker, x, y, arm, colour, widthPixels }: FixMarkerProps) {
  if (marker === 'triangle') {
    const r = arm + 1;
    return (
      <>
        <RegularPolygon x={x} y={y} sides={3} radius={r} stroke="#fffdf8" strokeWidth={widthPixels + 3} />
        <RegularPolygon x={x} y={y} sides={3} radius={r} stroke={colour} strokeWidth={widthPixels} />
        <Circle x={x} y={y} radius={1.8} fill={colour} />
      </>
    );
  }
  const d = marker === 'cross' ? arm * Math.SQRT1_2 : 0;
  const strokes = marker === 'cross'
    ? [[x - d, y - d, x + d, y + d], [x - d, y + d, x + d, y - d]]
    : [[x - arm, y, x + arm, y], [x, y - arm, x, y + arm]];
  return (
    <>
      {strokes.map((points, k) => <Line key={`halo-${k}`} points={points} stroke="#fffdf8" strokeWidth={widthPixels + 3} lineCap="round" />)}
      {strokes.map((points, k) => <Line key={`mark-${k}`} points={points} stroke={colour} strokeWidth={widthPixels} lineCap="round" />)}
    </>
  );
}

/** Map text on a light halo, readable over curves, the grid and the overlay. */
function HaloText(props: ComponentProps<typeof Text>) {
  return <Text stroke="#fbf9f4" strokeWidth={3} fillAfterStrokeEnabled {...props} />;
}
