//! SMILES parsing (OpenSMILES) into a molecular graph, with located errors.
