using System.Runtime.CompilerServices;
using Tessel.Core.Jobs;

namespace Tessel.Tests;

/// <summary>Settings for the whole test assembly, applied before any test runs.</summary>
internal static class TestSetup
{
    /// <summary>Memory messages name the budget of the machine they run on; tests fix it at 16 GB so
    /// that the same job gives the same message on every machine.</summary>
#pragma warning disable CA2255 // a test assembly's own set-up, not a library's
    [ModuleInitializer]
    internal static void FixMemoryBudget() => MemoryEstimate.BudgetBytes = 16e9;
#pragma warning restore CA2255
}
