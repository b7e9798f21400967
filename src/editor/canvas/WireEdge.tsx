// A wire: an orthogonal run from pin to pin, leaving each pin in the direction its lead points.
import { memo } from 'react';
import { BaseEdge, getSmoothStepPath, useInternalNode, type EdgeProps } from '@xyflow/react';
import { pinPosition, snapToGrid } from '../symbols/geometry';
import { SIDE_TO_HANDLE, type PartFlowNode, type WireFlowEdge } from './flowAdapter';

function pinOf(node: ReturnType<typeof useInternalNode<PartFlowNode>>, pin: string | null | undefined) {
  const d = node?.data;
  if (!d || !pin) return null;
  return pinPosition(d.type, pin, d.position, d.rotation) ?? null;
}

function WireEdgeView({ id, source, target, sourceHandleId, targetHandleId, selected }: EdgeProps<WireFlowEdge>) {
  // Pin positions come from the document (exact), not from measured handle boxes.
  const a = pinOf(useInternalNode<PartFlowNode>(source), sourceHandleId);
  const b = pinOf(useInternalNode<PartFlowNode>(target), targetHandleId);
  if (!a || !b) return null;
  const [path] = getSmoothStepPath({
    sourceX: a.x,
    sourceY: a.y,
    sourcePosition: SIDE_TO_HANDLE[a.side],
    targetX: b.x,
    targetY: b.y,
    targetPosition: SIDE_TO_HANDLE[b.side],
    borderRadius: 0,
    offset: 20,
    centerX: snapToGrid((a.x + b.x) / 2),
    centerY: snapToGrid((a.y + b.y) / 2),
  });
  return <BaseEdge id={id} path={path} className={`tl-wire ${selected ? 'is-selected' : ''}`} interactionWidth={14} />;
}

export const WireEdge = memo(WireEdgeView);
