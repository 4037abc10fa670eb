//! The registration table: one line per kernel. Adding a model to the Python
//! package adds exactly one line here.

use super::ufunc::{entry, Entry};
use crate::{chf, departure, nucleation, water, wetting};

pub fn entries() -> Vec<Entry> {
    vec![
        entry::<water::SaturationT, 1, 12>(),
        entry::<water::SaturationP, 1, 12>(),
        entry::<nucleation::EmbryoSuperheat, 6, 1>(),
        entry::<nucleation::EmbryoRadius, 6, 1>(),
        entry::<nucleation::EmbryoSuperheatExact, 7, 1>(),
        entry::<nucleation::BarrierFactor, 1, 1>(),
        entry::<nucleation::KineticSuperheatWater, 3, 1>(),
        entry::<nucleation::HomogeneousSuperheatWater, 2, 1>(),
        entry::<nucleation::Bankoff, 2, 1>(),
        entry::<nucleation::HsuActiveRadii, 9, 2>(),
        entry::<nucleation::HsuOnset, 8, 2>(),
        entry::<nucleation::DavisAnderson, 7, 2>(),
        entry::<nucleation::KandlikarOnset, 8, 2>(),
        entry::<nucleation::BerglesRohsenow, 2, 1>(),
        entry::<nucleation::WangDhir, 7, 1>(),
        entry::<nucleation::Basu, 3, 1>(),
        entry::<nucleation::HibikiIshii, 9, 1>(),
        entry::<nucleation::LemmertChawla, 1, 1>(),
        entry::<departure::Fritz, 5, 1>(),
        entry::<departure::ColeRohsenow, 8, 1>(),
        entry::<departure::KocamustafaogullariIshii, 5, 1>(),
        entry::<departure::ForceBalance, 17, 5>(),
        entry::<departure::ColeFrequency, 5, 1>(),
        entry::<departure::ZuberFrequency, 6, 1>(),
        entry::<departure::IveyHydrodynamicFrequency, 2, 1>(),
        entry::<departure::IveyTransitionFrequency, 2, 1>(),
        entry::<departure::WaitingTime, 10, 1>(),
        entry::<chf::Zuber, 6, 1>(),
        entry::<chf::Kandlikar, 7, 1>(),
        entry::<wetting::YoungAngle, 3, 1>(),
        entry::<wetting::SpreadingCoefficient, 3, 1>(),
        entry::<wetting::AdhesionWork, 2, 1>(),
        entry::<wetting::GirifalcoGood, 3, 1>(),
        entry::<wetting::OwrkAngle, 4, 1>(),
        entry::<wetting::Wenzel, 2, 1>(),
        entry::<wetting::CassieBaxter, 3, 1>(),
        entry::<wetting::RetentionForce, 5, 1>(),
        entry::<wetting::SlidingAngle, 7, 1>(),
        entry::<wetting::VdwDisjoiningPressure, 2, 1>(),
        entry::<wetting::PowerLawDisjoiningPressure, 3, 1>(),
        entry::<wetting::VdwFilmThickness, 5, 1>(),
        entry::<wetting::EffectiveHamaker, 2, 1>(),
    ]
}
