// Engine tests run whole sessions on a scaled clock: a wall-clock stall looks like minutes of
// virtual time to the settle rule, so they run one at a time, never beside each other.
[assembly: CollectionBehavior(DisableTestParallelization = true)]
