//! Symmetry numbers (external x internal rotation) and optical isomer counts from the graph.
