//! Aromaticity perception on Kekulé structures (Hückel rule over rings and fused ring pairs).
