document.getElementById("root")!.textContent="x";
