//! The registration table: one line per kernel. Adding a model to the Python
//! package adds exactly one line here.

use super::ufunc::{entry, Entry};
use crate::{chf, departure, nucleation};

pub fn entries() -> Vec<Entry> {
    vec![
        entry::<nucleation::EmbryoSuperheat, 6, 1>(),
        entry::<nucleation::EmbryoRadius, 6, 1>(),
        entry::<departure::Fritz, 5, 1>(),
        entry::<chf::Zuber, 6, 1>(),
        entry::<chf::Kandlikar, 7, 1>(),
    ]
}
