//! Ring perception: smallest set of smallest rings and ring systems (isolated, fused, bridged, spiro).
