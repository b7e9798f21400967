// The schematic canvas: React Flow as a view of the sheet. Every gesture becomes an editor action;
// React Flow never owns the parts or wires.
import { memo, useCallback, useMemo, useState, type DragEvent, type MouseEvent } from 'react';
import {
  ConnectionMode,
  ReactFlow,
  ViewportPortal,
  useReactFlow,
  type Connection,
  type EdgeChange,
  type NodeChange,
} from '@xyflow/react';
import { useShallow } from 'zustand/react/shallow';
import { isPartType, type PartType } from '../../../shared/parts/specs';
import { useEditor, useEditorState } from '../EditorContext';
import { CanvasDerivedContext } from './CanvasDerived';
import { createEdgeMapper, createNodeMapper, partCenter, wireCounts, type PartFlowNode, type WireFlowEdge } from './flowAdapter';
import { PartNode } from './PartNode';
import { WireEdge } from './WireEdge';
import { GridDots } from './GridDots';
import { PartSymbol } from '../symbols/PartSymbol';
import { GRID, snapToGrid } from '../symbols/geometry';
import { notify } from '../notices';
import { useFitSchematic, useInitialFit } from './fitSchematic';

const nodeTypes = { part: PartNode };
const edgeTypes = { wire: WireEdge };
export const PART_DRAG_MIME = 'application/x-tapline-part';
const SNAP_GRID: [number, number] = [GRID, GRID];
const PAN_BUTTONS = [1, 2];
const MULTI_SELECT_KEYS = ['Shift', 'Meta', 'Control'];
const isValidConnection = (c: Connection | WireFlowEdge) => !(c.source === c.target && c.sourceHandle === c.targetHandle);

/** The canvas; memoised, as nothing the editor screen re-renders for changes what it draws. */
export const SchematicCanvas = memo(function SchematicCanvas({ showReadings }: { showReadings: boolean }) {
  const editor = useEditor();
  const rf = useReactFlow<PartFlowNode, WireFlowEdge>();
  const { parts, wires, readOnly, tool, style } = useEditorState(
    useShallow((s) => ({ parts: s.doc.parts, wires: s.doc.wires, readOnly: s.session.readOnly, tool: s.session.tool, style: s.session.symbolStyle })),
  );
  const selection = useEditorState((s) => s.session.selection);
  const [ghost, setGhost] = useState<{ x: number; y: number } | null>(null);

  useInitialFit(useFitSchematic());
  const mapNodes = useMemo(createNodeMapper, []);
  const mapEdges = useMemo(createEdgeMapper, []);
  const nodes = useMemo(() => mapNodes(parts, new Set(selection.parts), readOnly), [mapNodes, parts, selection.parts, readOnly]);
  const edges = useMemo(() => mapEdges(wires, new Set(selection.wires)), [mapEdges, wires, selection.wires]);
  const derived = useMemo(() => ({ wireCounts: wireCounts({ wires }), showReadings }), [wires, showReadings]);

  const onNodesChange = useCallback(
    (changes: NodeChange<PartFlowNode>[]) => {
      const byId = new Map(editor.getDoc().parts.map((p) => [p.id, p] as const));
      const centers: Record<string, { x: number; y: number }> = {};
      const add: string[] = [];
      const remove: string[] = [];
      for (const c of changes) {
        if (c.type === 'position' && c.position) {
          const part = byId.get(c.id);
          if (part) centers[c.id] = partCenter(part, c.position);
        } else if (c.type === 'select') (c.selected ? add : remove).push(c.id);
      }
      if (Object.keys(centers).length) editor.actions.moveParts(centers);
      if (add.length || remove.length)
        editor.updateSession((s) => {
          const set = new Set(s.selection.parts);
          for (const id of remove) set.delete(id);
          for (const id of add) set.add(id);
          s.selection.parts = [...set];
        });
    },
    [editor],
  );

  const onEdgesChange = useCallback(
    (changes: EdgeChange<WireFlowEdge>[]) => {
      const sel = changes.filter((c) => c.type === 'select');
      if (!sel.length) return;
      editor.updateSession((s) => {
        const set = new Set(s.selection.wires);
        for (const c of sel) {
          if (c.selected) set.add(c.id);
          else set.delete(c.id);
        }
        s.selection.wires = [...set];
      });
    },
    [editor],
  );

  const onConnect = useCallback(
    (c: Connection) => {
      if (!c.sourceHandle || !c.targetHandle) return;
      const r = editor.actions.connect(`${c.source}.${c.sourceHandle}`, `${c.target}.${c.targetHandle}`);
      if (!r.ok) notify(r.message, 'error');
    },
    [editor],
  );

  const placeAt = useCallback(
    (type: PartType, clientX: number, clientY: number) => {
      const p = rf.screenToFlowPosition({ x: clientX, y: clientY });
      return editor.actions.place(type, p);
    },
    [editor, rf],
  );

  const onPaneClick = useCallback(
    (e: MouseEvent) => {
      if (tool.kind !== 'place') return;
      placeAt(tool.partType, e.clientX, e.clientY);
      // Shift keeps the tool for placing several of the same part
      if (!e.shiftKey) editor.actions.setTool({ kind: 'select' });
    },
    [editor, placeAt, tool],
  );

  // on the wrapper, not the pane: React Flow does not report pane moves while box selection is on
  const onMouseMove = useCallback(
    (e: MouseEvent) => {
      if (tool.kind !== 'place') return;
      const p = rf.screenToFlowPosition({ x: e.clientX, y: e.clientY });
      setGhost({ x: snapToGrid(p.x), y: snapToGrid(p.y) });
    },
    [rf, tool.kind],
  );

  // stable handlers: React Flow copies changed props into its own store on every render
  const onNodeDragStart = useCallback((_e: unknown, _n: PartFlowNode, dragged: PartFlowNode[]) => editor.actions.beginDrag(dragged.length), [editor]);
  const onNodeDragStop = useCallback(() => editor.actions.endDrag(), [editor]);
  const onMoveEnd = useCallback(
    (_e: unknown, vp: { x: number; y: number; zoom: number }) => editor.updateSession((s) => void (s.viewport = { x: vp.x, y: vp.y, zoom: vp.zoom })),
    [editor],
  );

  const onDrop = useCallback(
    (e: DragEvent) => {
      const type = e.dataTransfer.getData(PART_DRAG_MIME);
      if (!isPartType(type)) return;
      e.preventDefault();
      placeAt(type, e.clientX, e.clientY);
    },
    [placeAt],
  );

  return (
    <CanvasDerivedContext.Provider value={derived}>
      <div
        className={`tl-canvas h-full w-full ${tool.kind === 'place' ? 'is-placing' : ''}`}
        data-testid="schematic-canvas"
        onDragOver={(e) => {
          if (e.dataTransfer.types.includes(PART_DRAG_MIME)) e.preventDefault();
        }}
        onDrop={onDrop}
        onMouseMove={onMouseMove}
        onMouseLeave={() => setGhost(null)}
      >
        <ReactFlow<PartFlowNode, WireFlowEdge>
          nodes={nodes}
          edges={edges}
          nodeTypes={nodeTypes}
          edgeTypes={edgeTypes}
          onNodesChange={onNodesChange}
          onEdgesChange={onEdgesChange}
          onConnect={onConnect}
          onNodeDragStart={onNodeDragStart}
          onNodeDragStop={onNodeDragStop}
          onPaneClick={onPaneClick}
          onMoveEnd={onMoveEnd}
          isValidConnection={isValidConnection}
          connectionMode={ConnectionMode.Loose}
          connectionRadius={18}
          snapToGrid
          snapGrid={SNAP_GRID}
          selectionOnDrag
          panOnDrag={PAN_BUTTONS}
          panActivationKeyCode="Space"
          multiSelectionKeyCode={MULTI_SELECT_KEYS}
          deleteKeyCode={null}
          disableKeyboardA11y
          nodesDraggable={!readOnly}
          nodesConnectable={!readOnly}
          elevateEdgesOnSelect
          minZoom={0.2}
          maxZoom={4}
          aria-label="Schematic canvas"
        >
          <GridDots />
          {tool.kind === 'place' && ghost && (
            <ViewportPortal>
              <div
                className="pointer-events-none absolute opacity-50"
                style={{ transform: `translate(${ghost.x}px, ${ghost.y}px) translate(-50%, -50%)` }}
              >
                <PartSymbol type={tool.partType} style={style} />
              </div>
            </ViewportPortal>
          )}
        </ReactFlow>
      </div>
    </CanvasDerivedContext.Provider>
  );
});
