//! The whole analysis chain in one call (in progress).
