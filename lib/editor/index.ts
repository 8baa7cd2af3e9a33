/**
 * The body-map editor: state, tools, commands and history in plain TypeScript (no view code).
 *
 * A view creates one `Editor`, reads its state with
 * `useSyncExternalStore(editor.subscribe, editor.getState)`, draws `state.doc.panels` at
 * `editor.layout()`, forwards pointer, key and wheel events, and calls the commands.
 */
export { Editor, createEditor, cssPxPerCm, zoomStep, type EditorOptions } from './editor';
export type * from './types';
export { toolIds } from './types';
export {
  centreOn,
  fallbackDensity,
  fitCamera,
  layoutOf,
  layoutPanels,
  panelAtScreen,
  panelDensity,
  panelLayout,
  screenToStitch,
  stitchToScreen,
  zoomCameraAt,
  zoomLimits,
  type PanelLayout,
} from './camera';
export * as commands from './commands';
export { zonePolygonProblem, type ReorderMove } from './commands';
export { counterpartPanel, findPanel, findZone, zonesInDrawOrder } from './document';
export { copyZoneToPanel, isSimplePolygon, mirrorZone, polygonArea, polygonBounds } from './geometry';
export { hitTest, handleRadiusPx } from './hit-test';
export { bindShortcuts, comboOfKey, defaultShortcuts, describeCombo, normalizeCombo, type Shortcut, type ShortcutGroup } from './shortcuts';
export { defaultSnapping, repeatOf, snapPoint } from './snapping';
export { closeRadiusPx } from './tools/draw-zone/drawing';
