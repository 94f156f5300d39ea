namespace CompAssist.Tui; internal static class Placeholder { }
