using System.Runtime.CompilerServices;

[assembly: CollectionBehavior(DisableTestParallelization = true)]

namespace CompAssist.Tui.Tests.Support;

internal static class HeadlessSetup
{
    // Without this the ANSI driver would write to the terminal that runs the tests.
    [ModuleInitializer]
    internal static void DisableRealDriverIo() => Environment.SetEnvironmentVariable("DisableRealDriverIO", "1");
}
