//! Airfoil coordinate files (in progress).
