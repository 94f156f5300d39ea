using CompAssist.Core.Common;
using CompAssist.Core.Export;
using CompAssist.Core.Workflow;

namespace CompAssist.Tui;

/// <summary>Writes a hand-off package into a folder (the command line supplies it, with the plots); returns a problem on failure.</summary>
public delegate Problem? HandoffWriter(DesignReport report, HandoffPackage package, HandoffOptions options, string folder, string caseName);
