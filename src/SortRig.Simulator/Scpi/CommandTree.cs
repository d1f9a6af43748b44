namespace SortRig.Simulator.Scpi;

/// <summary>The full command tree of the simulated meter.</summary>
internal static class CommandTree
{
    public static CommandTable Build()
    {
        var table = new CommandTable();
        CommonCommands.Register(table);
        SenseCommands.Register(table);
        ConfigureCommands.Register(table);
        TriggerCommands.Register(table);
        RouteCommands.Register(table);
        SystemCommands.Register(table);
        SimulationCommands.Register(table);
        return table;
    }
}
