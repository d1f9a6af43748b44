namespace SortRig.Simulator.Physics;

/// <summary>Which bench physics the simulator runs. See docs/simulator.md, "Physics models".</summary>
public enum PhysicsModel
{
    /// <summary>One exponential cooling per part, white reading noise, the ambient as specified (today's
    /// model).</summary>
    Simple = 0,

    /// <summary>
    /// Two thermal paths per part (body, and leads into the fixture) with random weights, self-heating from the
    /// test current, slow ambient wander, low-frequency (1/f-like) excess noise and occasional popcorn steps.
    /// </summary>
    Rich = 1,
}
